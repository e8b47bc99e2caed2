import type { MigrationInterface, QueryRunner } from 'typeorm';

/** The face sketch of a round: a versioned JSON document (packages/domain sketch.ts), saved with the round. */
export class RoundSketch1796320000000 implements MigrationInterface {
  name = 'RoundSketch1796320000000';

  public async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`ALTER TABLE \`rounds\` ADD \`sketch\` json NULL`);
  }

  public async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`ALTER TABLE \`rounds\` DROP COLUMN \`sketch\``);
  }
}
