import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * Indexes for the Board at 30,000 rounds (`npm run load`): heading + status + face chainage, so the furthest
 * face handed in and a draft's face are MIN/MAX read from the index (it replaces heading + status, its
 * prefix), and heading + status + confirmation time, so the heading's latest confirmed round is one seek
 * instead of a read of every confirmed round's row.
 */
export class RoundStatusIndexes1796420000000 implements MigrationInterface {
  name = 'RoundStatusIndexes1796420000000';

  public async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(
      `CREATE INDEX \`IDX_rounds_heading_status_face\` ON \`rounds\` (\`heading_id\`, \`status\`, \`face_chainage\`)`,
    );
    await queryRunner.query(
      `CREATE INDEX \`IDX_rounds_heading_status_confirmed\` ON \`rounds\` (\`heading_id\`, \`status\`, \`confirmed_at\`)`,
    );
    await queryRunner.query(`DROP INDEX \`IDX_rounds_heading_status\` ON \`rounds\``);
  }

  public async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(
      `CREATE INDEX \`IDX_rounds_heading_status\` ON \`rounds\` (\`heading_id\`, \`status\`)`,
    );
    await queryRunner.query(`DROP INDEX \`IDX_rounds_heading_status_confirmed\` ON \`rounds\``);
    await queryRunner.query(`DROP INDEX \`IDX_rounds_heading_status_face\` ON \`rounds\``);
  }
}
