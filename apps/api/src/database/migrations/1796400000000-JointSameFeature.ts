import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * "Same feature as" on a joint: the first observation of a persistent feature on an earlier round, so a
 * feature seen on several faces is counted once when a stretch of the heading is analysed.
 */
export class JointSameFeature1796400000000 implements MigrationInterface {
  name = 'JointSameFeature1796400000000';

  public async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`ALTER TABLE \`joints\` ADD \`same_as_joint_id\` uuid NULL`);
    await queryRunner.query(`CREATE INDEX \`IDX_joints_same_as\` ON \`joints\` (\`same_as_joint_id\`)`);
  }

  public async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`DROP INDEX \`IDX_joints_same_as\` ON \`joints\``);
    await queryRunner.query(`ALTER TABLE \`joints\` DROP COLUMN \`same_as_joint_id\``);
  }
}
