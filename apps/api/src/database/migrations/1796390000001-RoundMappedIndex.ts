import type { MigrationInterface, QueryRunner } from 'typeorm';

/** The heading's latest round by mapping time, read by one index seek (the Board's "last round"). */
export class RoundMappedIndex1796390000001 implements MigrationInterface {
  name = 'RoundMappedIndex1796390000001';

  public async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(
      `CREATE INDEX \`IDX_rounds_heading_mapped\` ON \`rounds\` (\`heading_id\`, \`mapped_at\`)`,
    );
  }

  public async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`DROP INDEX \`IDX_rounds_heading_mapped\` ON \`rounds\``);
  }
}
