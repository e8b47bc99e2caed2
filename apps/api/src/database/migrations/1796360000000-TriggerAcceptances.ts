import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * Accepted standing conditions (issue 11, item 3): an engineer's acceptance of a fired trigger rule on a
 * heading, for a chainage range or until a date, with the reason and a snapshot of what fired; withdrawn
 * acceptances are kept (withdrawn_at), never deleted.
 */
export class TriggerAcceptances1796360000000 implements MigrationInterface {
  name = 'TriggerAcceptances1796360000000';

  public async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(
      `CREATE TABLE \`trigger_acceptances\` (
        \`id\` uuid NOT NULL,
        \`project_id\` uuid NOT NULL,
        \`heading_id\` uuid NOT NULL,
        \`rule_id\` uuid NOT NULL,
        \`round_id\` uuid NOT NULL,
        \`revision\` int NOT NULL,
        \`level\` enum ('green', 'amber', 'red') NOT NULL,
        \`from_chainage\` decimal(12,3) NULL,
        \`to_chainage\` decimal(12,3) NULL,
        \`until\` datetime(3) NULL,
        \`reason\` text NOT NULL,
        \`snapshot\` json NOT NULL,
        \`accepted_by\` uuid NOT NULL,
        \`accepted_name\` varchar(120) NOT NULL,
        \`accepted_at\` datetime(3) NOT NULL,
        \`withdrawn_at\` datetime(3) NULL,
        \`withdrawn_by\` uuid NULL,
        INDEX \`IDX_trigger_acceptances_heading\` (\`heading_id\`, \`withdrawn_at\`),
        INDEX \`IDX_trigger_acceptances_round\` (\`round_id\`),
        PRIMARY KEY (\`id\`),
        CONSTRAINT \`FK_trigger_acceptances_heading\` FOREIGN KEY (\`heading_id\`) REFERENCES \`headings\`(\`id\`) ON DELETE CASCADE,
        CONSTRAINT \`FK_trigger_acceptances_round\` FOREIGN KEY (\`round_id\`) REFERENCES \`rounds\`(\`id\`) ON DELETE CASCADE
      ) ENGINE=InnoDB`,
    );
  }

  public async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`DROP TABLE \`trigger_acceptances\``);
  }
}
