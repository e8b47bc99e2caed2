import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * Overdue handovers: the project sets how long the incoming supervisor has to acknowledge (60 minutes by
 * default, our choice); each handover keeps the time it is due by, frozen when sent, and the notice sent once
 * when it ran past it unacknowledged.
 */
export class HandoverOverdue1796340000000 implements MigrationInterface {
  name = 'HandoverOverdue1796340000000';

  public async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`ALTER TABLE \`projects\` ADD \`handover_ack_minutes\` int NOT NULL DEFAULT 60`);
    await queryRunner.query(`ALTER TABLE \`handovers\` ADD \`ack_due_at\` datetime(3) NULL`);
    await queryRunner.query(
      `UPDATE \`handovers\` SET \`ack_due_at\` = \`sent_at\` + INTERVAL 60 MINUTE WHERE \`ack_due_at\` IS NULL`,
    );
    await queryRunner.query(`ALTER TABLE \`handovers\` MODIFY \`ack_due_at\` datetime(3) NOT NULL`);
    await queryRunner.query(`ALTER TABLE \`handovers\` ADD \`overdue_notice_id\` uuid NULL`);
  }

  public async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`ALTER TABLE \`handovers\` DROP COLUMN \`overdue_notice_id\``);
    await queryRunner.query(`ALTER TABLE \`handovers\` DROP COLUMN \`ack_due_at\``);
    await queryRunner.query(`ALTER TABLE \`projects\` DROP COLUMN \`handover_ack_minutes\``);
  }
}
