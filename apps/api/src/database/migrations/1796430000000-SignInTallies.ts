import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * Failed sign-ins per account and per client address, kept in the database so every API process counts the
 * same failures (they were counted in each process's memory: with two processes behind one address, an
 * attacker had twice the allowance, and a restart forgot every block).
 */
export class SignInTallies1796430000000 implements MigrationInterface {
  name = 'SignInTallies1796430000000';

  public async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(
      `CREATE TABLE \`sign_in_tallies\` (
        \`tally_key\` varchar(340) NOT NULL,
        \`failures\` int UNSIGNED NOT NULL,
        \`last_failure_ms\` bigint NOT NULL,
        \`blocked_until_ms\` bigint NOT NULL DEFAULT 0,
        PRIMARY KEY (\`tally_key\`),
        INDEX \`IDX_sign_in_tallies_last_failure\` (\`last_failure_ms\`)
      ) ENGINE=InnoDB`,
    );
  }

  public async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`DROP TABLE \`sign_in_tallies\``);
  }
}
