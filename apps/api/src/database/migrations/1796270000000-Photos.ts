import type { MigrationInterface, QueryRunner } from 'typeorm';

/** Photos of a round: the original's key in object storage, its upload, the smaller sizes and the pin. */
export class Photos1796270000000 implements MigrationInterface {
  name = 'Photos1796270000000';

  public async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(
      `CREATE TABLE \`photos\` (\`id\` uuid NOT NULL, \`project_id\` uuid NOT NULL, \`round_id\` uuid NOT NULL, \`object_key\` varchar(255) NOT NULL, \`upload_id\` varchar(255) NULL, \`upload_state\` enum ('uploading', 'stored') NOT NULL DEFAULT 'uploading', \`content_type\` varchar(64) NOT NULL, \`size\` int NOT NULL, \`part_size\` int NOT NULL, \`original_name\` varchar(255) NOT NULL, \`caption\` varchar(500) NOT NULL DEFAULT '', \`face_part\` enum ('face', 'crown', 'left-wall', 'right-wall', 'invert', 'probe') NULL, \`taken_at\` datetime(3) NULL, \`uploaded_by\` uuid NOT NULL, \`pin_x\` double NULL, \`pin_y\` double NULL, \`variant_state\` enum ('pending', 'ready', 'failed') NOT NULL DEFAULT 'pending', \`thumbnail_key\` varchar(255) NULL, \`display_key\` varchar(255) NULL, \`width\` int NULL, \`height\` int NULL, \`created_at\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3), \`updated_at\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3) ON UPDATE CURRENT_TIMESTAMP(3), \`deleted_at\` datetime(3) NULL, INDEX \`IDX_photos_round\` (\`round_id\`, \`created_at\`), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`,
    );
    await queryRunner.query(
      `ALTER TABLE \`photos\` ADD CONSTRAINT \`FK_photos_round\` FOREIGN KEY (\`round_id\`) REFERENCES \`rounds\`(\`id\`) ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
  }

  public async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`ALTER TABLE \`photos\` DROP FOREIGN KEY \`FK_photos_round\``);
    await queryRunner.query(`DROP TABLE \`photos\``);
  }
}
