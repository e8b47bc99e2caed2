import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * Review (issue 11): the engineer's confirmed class and next round length kept apart from the geologist's
 * recommendation; every review decision with its sign-off; the comments of a return, per section, until
 * resolved; the acknowledgements of fired trigger rules by their owners; and the project's
 * separation-of-duties setting (on by default).
 */
export class Review1796200000000 implements MigrationInterface {
  name = 'Review1796200000000';

  public async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`ALTER TABLE \`rounds\` ADD \`confirmed_class_id\` uuid NULL`);
    await queryRunner.query(`ALTER TABLE \`rounds\` ADD \`confirmed_round_length\` decimal(5,2) NULL`);
    await queryRunner.query(`ALTER TABLE \`rounds\` ADD \`confirmed_at\` datetime(3) NULL`);
    await queryRunner.query(
      `ALTER TABLE \`rounds\` ADD CONSTRAINT \`FK_rounds_confirmed_class\` FOREIGN KEY (\`confirmed_class_id\`) REFERENCES \`support_classes\`(\`id\`) ON DELETE RESTRICT ON UPDATE NO ACTION`,
    );
    await queryRunner.query(
      `ALTER TABLE \`projects\` ADD \`separation_of_duties\` tinyint NOT NULL DEFAULT 1`,
    );
    await queryRunner.query(
      `CREATE TABLE \`round_decisions\` (
        \`id\` uuid NOT NULL,
        \`round_id\` uuid NOT NULL,
        \`project_id\` uuid NOT NULL,
        \`revision\` int NOT NULL,
        \`decision\` enum ('confirm', 'return', 'correct') NOT NULL,
        \`class_id\` uuid NULL,
        \`round_length\` decimal(5,2) NULL,
        \`recommended_class_id\` uuid NULL,
        \`reason\` text NOT NULL,
        \`comments\` text NOT NULL,
        \`signed_by\` uuid NOT NULL,
        \`signed_name\` varchar(120) NOT NULL,
        \`signed_role\` varchar(20) NOT NULL,
        \`signed_at\` datetime(3) NOT NULL,
        INDEX \`IDX_round_decisions_round\` (\`round_id\`, \`signed_at\`),
        PRIMARY KEY (\`id\`),
        CONSTRAINT \`FK_round_decisions_round\` FOREIGN KEY (\`round_id\`) REFERENCES \`rounds\`(\`id\`) ON DELETE CASCADE
      ) ENGINE=InnoDB`,
    );
    await queryRunner.query(
      `CREATE TABLE \`round_comments\` (
        \`id\` uuid NOT NULL,
        \`round_id\` uuid NOT NULL,
        \`revision\` int NOT NULL,
        \`section\` varchar(20) NOT NULL,
        \`text\` text NOT NULL,
        \`author_id\` uuid NOT NULL,
        \`author_name\` varchar(120) NOT NULL,
        \`created_at\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
        \`resolved_at\` datetime(3) NULL,
        \`resolved_by\` uuid NULL,
        INDEX \`IDX_round_comments_round\` (\`round_id\`, \`resolved_at\`),
        PRIMARY KEY (\`id\`),
        CONSTRAINT \`FK_round_comments_round\` FOREIGN KEY (\`round_id\`) REFERENCES \`rounds\`(\`id\`) ON DELETE CASCADE
      ) ENGINE=InnoDB`,
    );
    await queryRunner.query(
      `CREATE TABLE \`trigger_acknowledgements\` (
        \`id\` uuid NOT NULL,
        \`round_id\` uuid NOT NULL,
        \`project_id\` uuid NOT NULL,
        \`rule_id\` uuid NOT NULL,
        \`revision\` int NOT NULL,
        \`level\` enum ('green', 'amber', 'red') NOT NULL,
        \`action_taken\` text NOT NULL,
        \`note\` text NOT NULL,
        \`acknowledged_by\` uuid NOT NULL,
        \`acknowledged_name\` varchar(120) NOT NULL,
        \`acknowledged_role\` varchar(20) NOT NULL,
        \`acknowledged_at\` datetime(3) NOT NULL,
        UNIQUE INDEX \`UQ_trigger_ack_round_rule_revision\` (\`round_id\`, \`rule_id\`, \`revision\`),
        PRIMARY KEY (\`id\`),
        CONSTRAINT \`FK_trigger_ack_round\` FOREIGN KEY (\`round_id\`) REFERENCES \`rounds\`(\`id\`) ON DELETE CASCADE
      ) ENGINE=InnoDB`,
    );
  }

  public async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`DROP TABLE \`trigger_acknowledgements\``);
    await queryRunner.query(`DROP TABLE \`round_comments\``);
    await queryRunner.query(`DROP TABLE \`round_decisions\``);
    await queryRunner.query(`ALTER TABLE \`projects\` DROP COLUMN \`separation_of_duties\``);
    await queryRunner.query(`ALTER TABLE \`rounds\` DROP FOREIGN KEY \`FK_rounds_confirmed_class\``);
    await queryRunner.query(`ALTER TABLE \`rounds\` DROP COLUMN \`confirmed_at\``);
    await queryRunner.query(`ALTER TABLE \`rounds\` DROP COLUMN \`confirmed_round_length\``);
    await queryRunner.query(`ALTER TABLE \`rounds\` DROP COLUMN \`confirmed_class_id\``);
  }
}
