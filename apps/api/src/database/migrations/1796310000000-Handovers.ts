import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * Handovers at shift change: a frozen snapshot of what was handed over, its headings (for each heading's
 * history), who handed over to whom, and the acknowledgement. Notices may carry attachments kept in object
 * storage (the handover's PDF).
 */
export class Handovers1796310000000 implements MigrationInterface {
  name = 'Handovers1796310000000';

  public async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(
      `CREATE TABLE \`handovers\` (\`id\` uuid NOT NULL, \`project_id\` uuid NOT NULL, \`outgoing_id\` uuid NOT NULL, \`incoming_id\` uuid NOT NULL, \`shift_date\` date NOT NULL, \`shift\` enum ('day', 'night') NOT NULL, \`status\` enum ('sent', 'acknowledged') NOT NULL DEFAULT 'sent', \`snapshot\` json NOT NULL, \`recipients\` json NOT NULL, \`notice_id\` uuid NULL, \`pdf_key\` varchar(255) NULL, \`sent_at\` datetime(3) NOT NULL, \`acknowledged_at\` datetime(3) NULL, \`acknowledged_by\` uuid NULL, \`acknowledge_comment\` text NULL, \`created_at\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3), \`updated_at\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3) ON UPDATE CURRENT_TIMESTAMP(3), \`version\` int NOT NULL, INDEX \`IDX_handovers_incoming\` (\`incoming_id\`, \`status\`, \`sent_at\`), INDEX \`IDX_handovers_project\` (\`project_id\`, \`sent_at\`), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`,
    );
    await queryRunner.query(
      `CREATE TABLE \`handover_headings\` (\`handover_id\` uuid NOT NULL, \`heading_id\` uuid NOT NULL, \`position\` int NOT NULL, INDEX \`IDX_handover_headings_heading\` (\`heading_id\`), PRIMARY KEY (\`handover_id\`, \`heading_id\`)) ENGINE=InnoDB`,
    );
    await queryRunner.query(
      `ALTER TABLE \`handovers\` ADD CONSTRAINT \`FK_handovers_project\` FOREIGN KEY (\`project_id\`) REFERENCES \`projects\`(\`id\`) ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
    await queryRunner.query(
      `ALTER TABLE \`handover_headings\` ADD CONSTRAINT \`FK_handover_headings_handover\` FOREIGN KEY (\`handover_id\`) REFERENCES \`handovers\`(\`id\`) ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
    await queryRunner.query(
      `ALTER TABLE \`handover_headings\` ADD CONSTRAINT \`FK_handover_headings_heading\` FOREIGN KEY (\`heading_id\`) REFERENCES \`headings\`(\`id\`) ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
    await queryRunner.query(`ALTER TABLE \`notices\` ADD \`attachments\` json NULL`);
  }

  public async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`ALTER TABLE \`notices\` DROP COLUMN \`attachments\``);
    await queryRunner.query(
      `ALTER TABLE \`handover_headings\` DROP FOREIGN KEY \`FK_handover_headings_heading\``,
    );
    await queryRunner.query(
      `ALTER TABLE \`handover_headings\` DROP FOREIGN KEY \`FK_handover_headings_handover\``,
    );
    await queryRunner.query(`ALTER TABLE \`handovers\` DROP FOREIGN KEY \`FK_handovers_project\``);
    await queryRunner.query(`DROP TABLE \`handover_headings\``);
    await queryRunner.query(`DROP TABLE \`handovers\``);
  }
}
