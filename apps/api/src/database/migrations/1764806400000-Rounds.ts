import type { MigrationInterface, QueryRunner } from 'typeorm';

export class Rounds1764806400000 implements MigrationInterface {
  name = 'Rounds1764806400000';

  public async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(
      `CREATE TABLE \`rounds\` (\`id\` uuid NOT NULL, \`project_id\` uuid NOT NULL, \`heading_id\` uuid NOT NULL, \`stage\` enum ('full-face', 'top-heading', 'bench', 'invert') NOT NULL, \`round_number\` int NOT NULL, \`face_chainage\` decimal(12,3) NOT NULL, \`previous_chainage\` decimal(12,3) NULL, \`round_length\` decimal(7,3) NULL, \`shift_date\` date NOT NULL, \`shift\` enum ('day', 'night') NOT NULL, \`mapped_by\` uuid NOT NULL, \`mapped_at\` datetime(3) NOT NULL, \`distant_parts\` text NOT NULL, \`ground\` json NOT NULL, \`q_input\` json NULL, \`rmr_input\` json NULL, \`gsi_observed\` decimal(5,1) NULL, \`q\` double NULL, \`rmr\` int NULL, \`gsi\` decimal(5,1) NULL, \`recommended_class_id\` uuid NULL, \`next_round_length\` decimal(5,2) NULL, \`recommendation_reason\` text NOT NULL, \`status\` enum ('draft', 'submitted', 'confirmed', 'returned') NOT NULL DEFAULT 'draft', \`revision\` int NOT NULL DEFAULT '1', \`submitted_at\` datetime(3) NULL, \`created_at\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3), \`updated_at\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3) ON UPDATE CURRENT_TIMESTAMP(3), \`version\` int NOT NULL, INDEX \`IDX_rounds_heading_date\` (\`heading_id\`, \`shift_date\`), INDEX \`IDX_rounds_heading_status\` (\`heading_id\`, \`status\`), INDEX \`IDX_rounds_heading_chainage\` (\`heading_id\`, \`face_chainage\`), UNIQUE INDEX \`UQ_rounds_heading_stage_number\` (\`heading_id\`, \`stage\`, \`round_number\`), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`,
    );
    await queryRunner.query(
      `CREATE TABLE \`joints\` (\`id\` uuid NOT NULL, \`round_id\` uuid NOT NULL, \`heading_id\` uuid NOT NULL, \`face_chainage\` decimal(12,3) NOT NULL, \`seq\` int NOT NULL, \`kind\` enum ('joint', 'bedding', 'foliation', 'fault', 'shear-zone', 'vein', 'contact') NOT NULL, \`orientation_text\` varchar(60) NOT NULL, \`notation\` varchar(24) NOT NULL, \`dip_direction\` decimal(6,2) NULL, \`dip\` decimal(5,2) NULL, \`orientation_error\` varchar(300) NULL, \`set_label\` varchar(20) NULL, \`set_override\` tinyint NOT NULL DEFAULT 0, \`spacing_m\` decimal(7,3) NULL, \`persistence_m\` decimal(7,2) NULL, \`aperture_mm\` decimal(7,2) NULL, \`jr\` decimal(3,1) NULL, \`jrc\` decimal(4,1) NULL, \`jrc_method\` enum ('profile-comb', 'tilt-test', 'visual') NULL, \`infill\` varchar(120) NOT NULL, \`ja\` decimal(4,2) NULL, \`water\` enum ('dry', 'damp', 'wet', 'dripping', 'flowing') NULL, \`thickness_m\` decimal(6,3) NULL, \`notes\` varchar(500) NOT NULL, INDEX \`IDX_joints_heading_chainage\` (\`heading_id\`, \`face_chainage\`), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`,
    );
    await queryRunner.query(
      `ALTER TABLE \`projects\` ADD \`ground_scale\` varchar(12) NOT NULL DEFAULT 'isrm'`,
    );
    await queryRunner.query(
      `ALTER TABLE \`rounds\` ADD CONSTRAINT \`FK_90dcede8ed3d91f08335f430d69\` FOREIGN KEY (\`heading_id\`) REFERENCES \`headings\`(\`id\`) ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
    await queryRunner.query(
      `ALTER TABLE \`rounds\` ADD CONSTRAINT \`FK_be5c1a076c228a455d608659fa8\` FOREIGN KEY (\`recommended_class_id\`) REFERENCES \`support_classes\`(\`id\`) ON DELETE RESTRICT ON UPDATE NO ACTION`,
    );
    await queryRunner.query(
      `ALTER TABLE \`joints\` ADD CONSTRAINT \`FK_06c9101eb302dcd0072c4d02c49\` FOREIGN KEY (\`round_id\`) REFERENCES \`rounds\`(\`id\`) ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
  }

  public async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`ALTER TABLE \`joints\` DROP FOREIGN KEY \`FK_06c9101eb302dcd0072c4d02c49\``);
    await queryRunner.query(`ALTER TABLE \`rounds\` DROP FOREIGN KEY \`FK_be5c1a076c228a455d608659fa8\``);
    await queryRunner.query(`ALTER TABLE \`rounds\` DROP FOREIGN KEY \`FK_90dcede8ed3d91f08335f430d69\``);
    await queryRunner.query(`ALTER TABLE \`projects\` DROP COLUMN \`ground_scale\``);
    await queryRunner.query(`DROP INDEX \`IDX_joints_heading_chainage\` ON \`joints\``);
    await queryRunner.query(`DROP TABLE \`joints\``);
    await queryRunner.query(`DROP INDEX \`UQ_rounds_heading_stage_number\` ON \`rounds\``);
    await queryRunner.query(`DROP INDEX \`IDX_rounds_heading_chainage\` ON \`rounds\``);
    await queryRunner.query(`DROP INDEX \`IDX_rounds_heading_status\` ON \`rounds\``);
    await queryRunner.query(`DROP INDEX \`IDX_rounds_heading_date\` ON \`rounds\``);
    await queryRunner.query(`DROP TABLE \`rounds\``);
  }
}
