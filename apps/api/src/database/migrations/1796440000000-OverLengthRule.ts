import type { MigrationInterface, QueryRunner } from 'typeorm';

const BEFORE = `'q', 'rmr89', 'inflow-per-10m', 'overbreak', 'adverse-orientation', 'crown-crossing-within', 'support-class-change', 'open-red-hazard'`;

/** A trigger rule may watch a round longer than the support class of the last round allows (issue 11 item 3). */
export class OverLengthRule1796440000000 implements MigrationInterface {
  name = 'OverLengthRule1796440000000';

  public async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(
      `ALTER TABLE \`trigger_rules\` MODIFY \`watch\` enum (${BEFORE}, 'round-over-class-length') NOT NULL`,
    );
  }

  public async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`DELETE FROM \`trigger_rules\` WHERE \`watch\` = 'round-over-class-length'`);
    await queryRunner.query(`ALTER TABLE \`trigger_rules\` MODIFY \`watch\` enum (${BEFORE}) NOT NULL`);
  }
}
