import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * Background jobs (claimed with FOR UPDATE SKIP LOCKED), the outbox of e-mails (notices, each with its
 * Message-ID and sent_at), the instance operator flag on users, and invitations pointing at their e-mail.
 */
export class JobsAndOperators1796193536073 implements MigrationInterface {
  name = 'JobsAndOperators1796193536073';

  public async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(
      `CREATE TABLE \`jobs\` (\`id\` uuid NOT NULL, \`kind\` varchar(64) NOT NULL, \`payload\` json NOT NULL, \`state\` enum ('pending', 'running', 'done', 'dead') NOT NULL DEFAULT 'pending', \`attempts\` int NOT NULL DEFAULT '0', \`next_attempt_at\` datetime(3) NOT NULL, \`last_error\` text NULL, \`dedupe_key\` varchar(191) NULL, \`locked_by\` varchar(64) NULL, \`locked_at\` datetime(3) NULL, \`finished_at\` datetime(3) NULL, \`created_at\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3), \`updated_at\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3) ON UPDATE CURRENT_TIMESTAMP(3), INDEX \`IDX_jobs_due\` (\`state\`, \`next_attempt_at\`), UNIQUE INDEX \`UQ_jobs_dedupe_key\` (\`dedupe_key\`), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`,
    );
    await queryRunner.query(
      `CREATE TABLE \`notices\` (\`id\` uuid NOT NULL, \`kind\` varchar(64) NOT NULL, \`project_id\` uuid NULL, \`to_addresses\` json NOT NULL, \`cc_addresses\` json NOT NULL, \`subject\` varchar(998) NOT NULL, \`text_body\` mediumtext NOT NULL, \`html_body\` mediumtext NULL, \`sensitive\` tinyint NOT NULL DEFAULT 0, \`message_id\` varchar(255) NOT NULL, \`sent_at\` datetime(3) NULL, \`created_at\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3), UNIQUE INDEX \`UQ_notices_message_id\` (\`message_id\`), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`,
    );
    await queryRunner.query(`ALTER TABLE \`users\` ADD \`is_operator\` tinyint NOT NULL DEFAULT 0`);
    // An instance seeded with the invented demo before operators existed: its demo admin runs it.
    await queryRunner.query(
      `UPDATE \`users\` SET \`is_operator\` = 1 WHERE \`email\` = 'admin@roundbook.test'`,
    );
    await queryRunner.query(`ALTER TABLE \`invitations\` ADD \`notice_id\` uuid NULL`);
    await queryRunner.query(`ALTER TABLE \`invitations\` DROP COLUMN \`email_sent_at\``);
  }

  public async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`ALTER TABLE \`invitations\` ADD \`email_sent_at\` datetime(3) NULL`);
    await queryRunner.query(`ALTER TABLE \`invitations\` DROP COLUMN \`notice_id\``);
    await queryRunner.query(`ALTER TABLE \`users\` DROP COLUMN \`is_operator\``);
    await queryRunner.query(`DROP TABLE \`notices\``);
    await queryRunner.query(`DROP TABLE \`jobs\``);
  }
}
