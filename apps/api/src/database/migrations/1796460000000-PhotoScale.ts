import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * A photo's scale (issue 14 item 4): two points marked on the photo, as fractions (0–1) of its upright
 * width and height, and the known distance between them in metres. All five are null when no scale is set.
 */
export class PhotoScale1796460000000 implements MigrationInterface {
  name = 'PhotoScale1796460000000';

  public async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(
      `ALTER TABLE \`photos\` ADD \`scale_ax\` double NULL AFTER \`pin_y\`, ADD \`scale_ay\` double NULL AFTER \`scale_ax\`, ADD \`scale_bx\` double NULL AFTER \`scale_ay\`, ADD \`scale_by\` double NULL AFTER \`scale_bx\`, ADD \`scale_m\` double NULL AFTER \`scale_by\``,
    );
  }

  public async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(
      `ALTER TABLE \`photos\` DROP COLUMN \`scale_m\`, DROP COLUMN \`scale_by\`, DROP COLUMN \`scale_bx\`, DROP COLUMN \`scale_ay\`, DROP COLUMN \`scale_ax\``,
    );
  }
}
