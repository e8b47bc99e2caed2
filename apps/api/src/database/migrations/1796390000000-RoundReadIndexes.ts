import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * Indexes for reads of large headings (found by `npm run load` at 30,000 rounds): the Rounds page sorted by
 * Q or RMR (without them every such page sorted all the heading's rounds), and one covering index for the
 * Board's per-heading progress (face, last round, rounds to confirm, latest level and support outstanding),
 * so that those aggregates read the index and not every round's row with its JSON.
 */
export class RoundReadIndexes1796390000000 implements MigrationInterface {
  name = 'RoundReadIndexes1796390000000';

  public async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`CREATE INDEX \`IDX_rounds_heading_q\` ON \`rounds\` (\`heading_id\`, \`q\`)`);
    await queryRunner.query(
      `CREATE INDEX \`IDX_rounds_heading_rmr\` ON \`rounds\` (\`heading_id\`, \`rmr\`)`,
    );
    await queryRunner.query(
      `CREATE INDEX \`IDX_rounds_heading_progress\` ON \`rounds\` (\`heading_id\`, \`status\`, \`stage\`, \`round_number\`, \`face_chainage\`, \`mapped_at\`, \`trigger_level\`)`,
    );
  }

  public async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`DROP INDEX \`IDX_rounds_heading_progress\` ON \`rounds\``);
    await queryRunner.query(`DROP INDEX \`IDX_rounds_heading_rmr\` ON \`rounds\``);
    await queryRunner.query(`DROP INDEX \`IDX_rounds_heading_q\` ON \`rounds\``);
  }
}
