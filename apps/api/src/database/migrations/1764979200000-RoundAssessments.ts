import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * One round, one truth: the assessment saved with the round (and frozen in its revisions), the set-finding
 * parameters, revisions, and idempotency keys for retried creates.
 */
export class RoundAssessments1764979200000 implements MigrationInterface {
  name = 'RoundAssessments1764979200000';

  public async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`ALTER TABLE \`rounds\` ADD \`assessment\` json NULL`);
    await queryRunner.query(`ALTER TABLE \`rounds\` ADD \`assessment_version\` varchar(40) NULL`);
    await queryRunner.query(`ALTER TABLE \`rounds\` ADD \`set_parameters\` json NULL`);
    await queryRunner.query(`ALTER TABLE \`rounds\` ADD \`triggers_not_evaluated\` int NOT NULL DEFAULT 0`);
    await queryRunner.query(
      `CREATE TABLE \`round_revisions\` (\`id\` uuid NOT NULL, \`round_id\` uuid NOT NULL, \`revision\` int NOT NULL, \`event\` enum ('submit', 'confirm', 'return', 'correct') NOT NULL, \`status\` varchar(20) NOT NULL, \`record\` json NOT NULL, \`assessment\` json NOT NULL, \`assessment_version\` varchar(40) NOT NULL, \`created_by\` uuid NOT NULL, \`created_at\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3), INDEX \`IDX_round_revisions_round\` (\`round_id\`, \`revision\`), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`,
    );
    await queryRunner.query(
      `ALTER TABLE \`round_revisions\` ADD CONSTRAINT \`FK_round_revisions_round\` FOREIGN KEY (\`round_id\`) REFERENCES \`rounds\`(\`id\`) ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
    await queryRunner.query(
      `CREATE TABLE \`idempotency_keys\` (\`user_id\` uuid NOT NULL, \`idempotency_key\` varchar(100) NOT NULL, \`scope\` varchar(60) NOT NULL, \`resource_id\` uuid NOT NULL, \`created_at\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3), PRIMARY KEY (\`user_id\`, \`idempotency_key\`)) ENGINE=InnoDB`,
    );
  }

  public async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`DROP TABLE \`idempotency_keys\``);
    await queryRunner.query(`ALTER TABLE \`round_revisions\` DROP FOREIGN KEY \`FK_round_revisions_round\``);
    await queryRunner.query(`DROP INDEX \`IDX_round_revisions_round\` ON \`round_revisions\``);
    await queryRunner.query(`DROP TABLE \`round_revisions\``);
    await queryRunner.query(`ALTER TABLE \`rounds\` DROP COLUMN \`triggers_not_evaluated\``);
    await queryRunner.query(`ALTER TABLE \`rounds\` DROP COLUMN \`set_parameters\``);
    await queryRunner.query(`ALTER TABLE \`rounds\` DROP COLUMN \`assessment_version\``);
    await queryRunner.query(`ALTER TABLE \`rounds\` DROP COLUMN \`assessment\``);
  }
}
