import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * Each person's choice of review notices per project (issue 11 item 4). No row means every notice is on;
 * red notices have no column because they cannot be switched off.
 */
export class NoticePreferences1796350000000 implements MigrationInterface {
  name = 'NoticePreferences1796350000000';

  public async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(
      `CREATE TABLE \`notice_preferences\` (\`user_id\` uuid NOT NULL, \`project_id\` uuid NOT NULL, \`submitted\` tinyint NOT NULL DEFAULT 1, \`rule_overdue\` tinyint NOT NULL DEFAULT 1, \`returned\` tinyint NOT NULL DEFAULT 1, \`confirmed_other_class\` tinyint NOT NULL DEFAULT 1, \`updated_at\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3) ON UPDATE CURRENT_TIMESTAMP(3), INDEX \`IDX_notice_preferences_project\` (\`project_id\`), PRIMARY KEY (\`user_id\`, \`project_id\`)) ENGINE=InnoDB`,
    );
    await queryRunner.query(
      `ALTER TABLE \`notice_preferences\` ADD CONSTRAINT \`FK_notice_preferences_user\` FOREIGN KEY (\`user_id\`) REFERENCES \`users\`(\`id\`) ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
    await queryRunner.query(
      `ALTER TABLE \`notice_preferences\` ADD CONSTRAINT \`FK_notice_preferences_project\` FOREIGN KEY (\`project_id\`) REFERENCES \`projects\`(\`id\`) ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
  }

  public async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(
      `ALTER TABLE \`notice_preferences\` DROP FOREIGN KEY \`FK_notice_preferences_project\``,
    );
    await queryRunner.query(
      `ALTER TABLE \`notice_preferences\` DROP FOREIGN KEY \`FK_notice_preferences_user\``,
    );
    await queryRunner.query(`DROP TABLE \`notice_preferences\``);
  }
}
