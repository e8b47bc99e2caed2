import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * Trust the numbers (issue 10): a heading's chainage sense, alignment (initial bearing, segments) and bench
 * line; a joint's trace position on the face.
 */
export class HeadingAlignment1796196409420 implements MigrationInterface {
  name = 'HeadingAlignment1796196409420';

  public async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(
      `ALTER TABLE \`headings\` ADD \`chainage_sense\` enum ('increasing', 'decreasing') NOT NULL DEFAULT 'increasing'`,
    );
    await queryRunner.query(`ALTER TABLE \`headings\` ADD \`initial_bearing\` decimal(6,2) NULL`);
    await queryRunner.query(`ALTER TABLE \`headings\` ADD \`alignment_segments\` json NULL`);
    await queryRunner.query(`ALTER TABLE \`headings\` ADD \`bench_height\` decimal(6,2) NULL`);
    await queryRunner.query(`ALTER TABLE \`joints\` ADD \`face_offset\` json NULL`);
  }

  public async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`ALTER TABLE \`joints\` DROP COLUMN \`face_offset\``);
    await queryRunner.query(`ALTER TABLE \`headings\` DROP COLUMN \`bench_height\``);
    await queryRunner.query(`ALTER TABLE \`headings\` DROP COLUMN \`alignment_segments\``);
    await queryRunner.query(`ALTER TABLE \`headings\` DROP COLUMN \`initial_bearing\``);
    await queryRunner.query(`ALTER TABLE \`headings\` DROP COLUMN \`chainage_sense\``);
  }
}
