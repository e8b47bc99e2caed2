import type { MigrationInterface, QueryRunner } from 'typeorm';

export class RoundTriggers1764892800000 implements MigrationInterface {
  name = 'RoundTriggers1764892800000';

  public async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(
      `ALTER TABLE \`rounds\` ADD \`trigger_level\` enum ('green', 'amber', 'red') NULL`,
    );
    await queryRunner.query(`ALTER TABLE \`rounds\` ADD \`trigger_firings\` json NULL`);
  }

  public async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`ALTER TABLE \`rounds\` DROP COLUMN \`trigger_firings\``);
    await queryRunner.query(`ALTER TABLE \`rounds\` DROP COLUMN \`trigger_level\``);
  }
}
