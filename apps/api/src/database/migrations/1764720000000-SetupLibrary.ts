import type { MigrationInterface, QueryRunner } from 'typeorm';

export class SetupLibrary1764720000000 implements MigrationInterface {
  name = 'SetupLibrary1764720000000';

  public async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(
      `CREATE TABLE \`support_classes\` (\`id\` uuid NOT NULL, \`project_id\` uuid NOT NULL, \`code\` varchar(20) NOT NULL, \`name\` varchar(120) NOT NULL, \`sort_order\` int NOT NULL, \`q_min\` double NULL, \`q_max\` double NULL, \`rmr_min\` int NULL, \`rmr_max\` int NULL, \`max_round_length\` decimal(4,2) NOT NULL, \`bolt_type\` varchar(120) NOT NULL DEFAULT '', \`bolt_length\` decimal(4,2) NULL, \`bolt_pattern\` varchar(120) NOT NULL DEFAULT '', \`shotcrete_mm\` int NOT NULL DEFAULT '0', \`steel_support\` varchar(160) NOT NULL DEFAULT '', \`probing_required\` tinyint NOT NULL DEFAULT 0, \`notes\` text NOT NULL, \`retired\` tinyint NOT NULL DEFAULT 0, \`created_at\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3), \`updated_at\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3) ON UPDATE CURRENT_TIMESTAMP(3), \`version\` int NOT NULL, UNIQUE INDEX \`UQ_support_classes_project_code\` (\`project_id\`, \`code\`), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`,
    );
    await queryRunner.query(
      `CREATE TABLE \`invitations\` (\`id\` uuid NOT NULL, \`project_id\` uuid NOT NULL, \`email\` varchar(254) NOT NULL, \`name\` varchar(120) NOT NULL DEFAULT '', \`role\` enum ('admin', 'geologist', 'engineer', 'supervisor', 'viewer') NOT NULL, \`token_hash\` char(64) NOT NULL, \`expires_at\` datetime(3) NOT NULL, \`invited_by\` uuid NOT NULL, \`accepted_at\` datetime(3) NULL, \`email_sent_at\` datetime(3) NULL, \`created_at\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3), UNIQUE INDEX \`IDX_invitations_token_hash\` (\`token_hash\`), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`,
    );
    await queryRunner.query(
      `CREATE TABLE \`trigger_rules\` (\`id\` uuid NOT NULL, \`project_id\` uuid NOT NULL, \`watch\` enum ('q', 'rmr89', 'inflow-per-10m', 'overbreak', 'adverse-orientation', 'crown-crossing-within', 'support-class-change', 'open-red-hazard') NOT NULL, \`comparison\` enum ('<', '<=', '>', '>=', '=') NULL, \`threshold\` decimal(12,4) NULL, \`level\` enum ('green', 'amber', 'red') NOT NULL, \`action\` text NOT NULL, \`owner_role\` enum ('admin', 'geologist', 'engineer', 'supervisor', 'viewer') NOT NULL, \`time_allowed_hours\` decimal(6,2) NOT NULL, \`enabled\` tinyint NOT NULL DEFAULT 1, \`created_at\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3), \`updated_at\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3) ON UPDATE CURRENT_TIMESTAMP(3), \`version\` int NOT NULL, PRIMARY KEY (\`id\`)) ENGINE=InnoDB`,
    );
    // Existing projects get an empty list, then the column becomes NOT NULL (hand-edited; no schema drift).
    await queryRunner.query(`ALTER TABLE \`projects\` ADD \`distribution_list\` json NULL`);
    await queryRunner.query(`UPDATE \`projects\` SET \`distribution_list\` = '[]'`);
    await queryRunner.query(`ALTER TABLE \`projects\` MODIFY \`distribution_list\` json NOT NULL`);
    await queryRunner.query(
      `ALTER TABLE \`projects\` ADD \`coordinate_grid\` varchar(120) NOT NULL DEFAULT ''`,
    );
    await queryRunner.query(
      `ALTER TABLE \`headings\` ADD \`chainage_style\` enum ('km+m', 'metres') NOT NULL DEFAULT 'km+m'`,
    );
    await queryRunner.query(
      `ALTER TABLE \`headings\` ADD \`chainage_decimals\` tinyint NOT NULL DEFAULT '1'`,
    );
    await queryRunner.query(`ALTER TABLE \`headings\` ADD \`start_easting\` decimal(12,3) NULL`);
    await queryRunner.query(`ALTER TABLE \`headings\` ADD \`start_northing\` decimal(12,3) NULL`);
    await queryRunner.query(`ALTER TABLE \`headings\` ADD \`start_elevation\` decimal(9,3) NULL`);
    await queryRunner.query(
      `ALTER TABLE \`support_classes\` ADD CONSTRAINT \`FK_fe3e6c54f1f87f3051a5daf37f0\` FOREIGN KEY (\`project_id\`) REFERENCES \`projects\`(\`id\`) ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
    await queryRunner.query(
      `ALTER TABLE \`invitations\` ADD CONSTRAINT \`FK_1462d5db7be95ebcafc9fcdf2e1\` FOREIGN KEY (\`project_id\`) REFERENCES \`projects\`(\`id\`) ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
    await queryRunner.query(
      `ALTER TABLE \`trigger_rules\` ADD CONSTRAINT \`FK_c6f823aaadd9a6a4eb818dec604\` FOREIGN KEY (\`project_id\`) REFERENCES \`projects\`(\`id\`) ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
  }

  public async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(
      `ALTER TABLE \`trigger_rules\` DROP FOREIGN KEY \`FK_c6f823aaadd9a6a4eb818dec604\``,
    );
    await queryRunner.query(
      `ALTER TABLE \`invitations\` DROP FOREIGN KEY \`FK_1462d5db7be95ebcafc9fcdf2e1\``,
    );
    await queryRunner.query(
      `ALTER TABLE \`support_classes\` DROP FOREIGN KEY \`FK_fe3e6c54f1f87f3051a5daf37f0\``,
    );
    await queryRunner.query(`ALTER TABLE \`headings\` DROP COLUMN \`start_elevation\``);
    await queryRunner.query(`ALTER TABLE \`headings\` DROP COLUMN \`start_northing\``);
    await queryRunner.query(`ALTER TABLE \`headings\` DROP COLUMN \`start_easting\``);
    await queryRunner.query(`ALTER TABLE \`headings\` DROP COLUMN \`chainage_decimals\``);
    await queryRunner.query(`ALTER TABLE \`headings\` DROP COLUMN \`chainage_style\``);
    await queryRunner.query(`ALTER TABLE \`projects\` DROP COLUMN \`coordinate_grid\``);
    await queryRunner.query(`ALTER TABLE \`projects\` DROP COLUMN \`distribution_list\``);
    await queryRunner.query(`DROP TABLE \`trigger_rules\``);
    await queryRunner.query(`DROP INDEX \`IDX_invitations_token_hash\` ON \`invitations\``);
    await queryRunner.query(`DROP TABLE \`invitations\``);
    await queryRunner.query(`DROP INDEX \`UQ_support_classes_project_code\` ON \`support_classes\``);
    await queryRunner.query(`DROP TABLE \`support_classes\``);
  }
}
