import type { MigrationInterface, QueryRunner } from 'typeorm';

/** Autosave runs are one audit event (last_at, coalesced), and an entity's events are found by index. */
export class AuditCoalesce1796280000000 implements MigrationInterface {
  name = 'AuditCoalesce1796280000000';

  public async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`ALTER TABLE \`audit_events\` ADD \`last_at\` datetime(3) NULL`);
    await queryRunner.query(`ALTER TABLE \`audit_events\` ADD \`coalesced\` int NOT NULL DEFAULT '0'`);
    await queryRunner.query(
      `CREATE INDEX \`IDX_audit_events_entity_at\` ON \`audit_events\` (\`entity_type\`, \`entity_id\`, \`created_at\`)`,
    );
  }

  public async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`DROP INDEX \`IDX_audit_events_entity_at\` ON \`audit_events\``);
    await queryRunner.query(`ALTER TABLE \`audit_events\` DROP COLUMN \`coalesced\``);
    await queryRunner.query(`ALTER TABLE \`audit_events\` DROP COLUMN \`last_at\``);
  }
}
