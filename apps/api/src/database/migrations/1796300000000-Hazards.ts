import type { MigrationInterface, QueryRunner } from 'typeorm';

/** The hazard register of each heading: kind, chainage range, level, origin, photos, open or closed. */
export class Hazards1796300000000 implements MigrationInterface {
  name = 'Hazards1796300000000';

  public async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(
      `CREATE TABLE \`hazards\` (\`id\` uuid NOT NULL, \`project_id\` uuid NOT NULL, \`heading_id\` uuid NOT NULL, \`kind\` enum ('loose-ground', 'wedge', 'water', 'gas', 'misfire', 'probe-finding', 'overbreak', 'other') NOT NULL, \`from_chainage\` decimal(12,3) NOT NULL, \`to_chainage\` decimal(12,3) NOT NULL, \`level\` enum ('green', 'amber', 'red') NOT NULL, \`description\` text NOT NULL, \`origin\` enum ('round', 'handover', 'direct') NOT NULL, \`round_id\` uuid NULL, \`handover_id\` uuid NULL, \`photo_ids\` json NOT NULL, \`status\` enum ('open', 'closed') NOT NULL DEFAULT 'open', \`raised_by\` uuid NOT NULL, \`closed_by\` uuid NULL, \`closed_at\` datetime(3) NULL, \`close_reason\` text NULL, \`created_at\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3), \`updated_at\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3) ON UPDATE CURRENT_TIMESTAMP(3), \`version\` int NOT NULL, INDEX \`IDX_hazards_heading_status\` (\`heading_id\`, \`status\`), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`,
    );
    await queryRunner.query(
      `ALTER TABLE \`hazards\` ADD CONSTRAINT \`FK_hazards_heading\` FOREIGN KEY (\`heading_id\`) REFERENCES \`headings\`(\`id\`) ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
  }

  public async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`ALTER TABLE \`hazards\` DROP FOREIGN KEY \`FK_hazards_heading\``);
    await queryRunner.query(`DROP TABLE \`hazards\``);
  }
}
