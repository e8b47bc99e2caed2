import type { MigrationInterface, QueryRunner } from 'typeorm';

/** Tokens can be revoked: each carries its account's token version, raised to end every session. */
export class TokenVersion1796290000000 implements MigrationInterface {
  name = 'TokenVersion1796290000000';

  public async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`ALTER TABLE \`users\` ADD \`token_version\` int NOT NULL DEFAULT '0'`);
  }

  public async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`ALTER TABLE \`users\` DROP COLUMN \`token_version\``);
  }
}
