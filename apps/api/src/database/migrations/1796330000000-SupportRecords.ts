import type { MigrationInterface, QueryRunner } from 'typeorm';

/** Support as built: one record per confirmed round, its checklist items as JSON. */
export class SupportRecords1796330000000 implements MigrationInterface {
  name = 'SupportRecords1796330000000';

  public async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(
      `CREATE TABLE \`support_records\` (\`id\` uuid NOT NULL, \`project_id\` uuid NOT NULL, \`heading_id\` uuid NOT NULL, \`round_id\` uuid NOT NULL, \`class_id\` uuid NOT NULL, \`items\` json NOT NULL, \`outstanding_count\` int NOT NULL, \`updated_by\` uuid NOT NULL, \`created_at\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3), \`updated_at\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3) ON UPDATE CURRENT_TIMESTAMP(3), \`version\` int NOT NULL, UNIQUE INDEX \`UQ_support_records_round\` (\`round_id\`), INDEX \`IDX_support_records_heading\` (\`heading_id\`), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`,
    );
    await queryRunner.query(
      `ALTER TABLE \`support_records\` ADD CONSTRAINT \`FK_support_records_round\` FOREIGN KEY (\`round_id\`) REFERENCES \`rounds\`(\`id\`) ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
  }

  public async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`ALTER TABLE \`support_records\` DROP FOREIGN KEY \`FK_support_records_round\``);
    await queryRunner.query(`DROP TABLE \`support_records\``);
  }
}
