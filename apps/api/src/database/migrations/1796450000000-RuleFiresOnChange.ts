import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * A trigger rule fires on the round's value (every rule so far) or on the change from the previous round of
 * the same heading and stage (issue 11 item 3).
 */
export class RuleFiresOnChange1796450000000 implements MigrationInterface {
  name = 'RuleFiresOnChange1796450000000';

  public async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(
      `ALTER TABLE \`trigger_rules\` ADD \`fires\` enum ('value', 'change') NOT NULL DEFAULT 'value' AFTER \`threshold\``,
    );
  }

  public async down(queryRunner: QueryRunner): Promise<void> {
    // A change rule read on the value would fire on other rounds than its owners chose: drop them.
    await queryRunner.query(`DELETE FROM \`trigger_rules\` WHERE \`fires\` = 'change'`);
    await queryRunner.query(`ALTER TABLE \`trigger_rules\` DROP COLUMN \`fires\``);
  }
}
