import type { MigrationInterface, QueryRunner } from 'typeorm';

export class Init1764633600000 implements MigrationInterface {
  name = 'Init1764633600000';

  public async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(
      `CREATE TABLE \`audit_events\` (\`id\` uuid NOT NULL, \`project_id\` uuid NULL, \`actor_id\` uuid NULL, \`entity_type\` varchar(40) NOT NULL, \`entity_id\` uuid NOT NULL, \`action\` varchar(40) NOT NULL, \`before\` json NULL, \`after\` json NULL, \`created_at\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3), INDEX \`IDX_audit_events_project_at\` (\`project_id\`, \`created_at\`), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`,
    );
    await queryRunner.query(
      `CREATE TABLE \`projects\` (\`id\` uuid NOT NULL, \`code\` varchar(20) NOT NULL, \`name\` varchar(160) NOT NULL, \`client\` varchar(160) NOT NULL DEFAULT '', \`time_zone\` varchar(64) NOT NULL DEFAULT 'UTC', \`q_table_edition\` varchar(40) NOT NULL DEFAULT '2015', \`default_notation\` varchar(24) NOT NULL DEFAULT 'dip-direction/dip', \`created_at\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3), \`updated_at\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3) ON UPDATE CURRENT_TIMESTAMP(3), \`version\` int NOT NULL, UNIQUE INDEX \`IDX_d95a87318392465ab663a32cc4\` (\`code\`), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`,
    );
    await queryRunner.query(
      `CREATE TABLE \`headings\` (\`id\` uuid NOT NULL, \`project_id\` uuid NOT NULL, \`code\` varchar(20) NOT NULL, \`name\` varchar(160) NOT NULL, \`start_chainage\` decimal(12,3) NOT NULL, \`drive_trend\` decimal(6,2) NOT NULL, \`gradient_percent\` decimal(7,3) NOT NULL, \`profile_shape\` enum ('circular', 'horseshoe', 'd-shaped', 'rectangular') NOT NULL, \`profile_width\` decimal(6,2) NOT NULL, \`profile_height\` decimal(6,2) NOT NULL, \`axis_height\` decimal(6,2) NOT NULL, \`stages\` text NOT NULL, \`planned_round_length\` decimal(5,2) NOT NULL, \`created_at\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3), \`updated_at\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3) ON UPDATE CURRENT_TIMESTAMP(3), \`version\` int NOT NULL, UNIQUE INDEX \`UQ_headings_project_code\` (\`project_id\`, \`code\`), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`,
    );
    await queryRunner.query(
      `CREATE TABLE \`users\` (\`id\` uuid NOT NULL, \`email\` varchar(254) NOT NULL, \`name\` varchar(120) NOT NULL, \`password_hash\` varchar(255) NULL, \`created_at\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3), \`updated_at\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3) ON UPDATE CURRENT_TIMESTAMP(3), \`version\` int NOT NULL, UNIQUE INDEX \`IDX_97672ac88f789774dd47f7c8be\` (\`email\`), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`,
    );
    await queryRunner.query(
      `CREATE TABLE \`project_members\` (\`id\` uuid NOT NULL, \`project_id\` uuid NOT NULL, \`user_id\` uuid NOT NULL, \`role\` enum ('admin', 'geologist', 'engineer', 'supervisor', 'viewer') NOT NULL, \`created_at\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3), \`updated_at\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3) ON UPDATE CURRENT_TIMESTAMP(3), UNIQUE INDEX \`UQ_project_members_project_user\` (\`project_id\`, \`user_id\`), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`,
    );
    await queryRunner.query(
      `ALTER TABLE \`headings\` ADD CONSTRAINT \`FK_4e52356a24e5d0e92d21d4a1a7f\` FOREIGN KEY (\`project_id\`) REFERENCES \`projects\`(\`id\`) ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
    await queryRunner.query(
      `ALTER TABLE \`project_members\` ADD CONSTRAINT \`FK_b5729113570c20c7e214cf3f58d\` FOREIGN KEY (\`project_id\`) REFERENCES \`projects\`(\`id\`) ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
    await queryRunner.query(
      `ALTER TABLE \`project_members\` ADD CONSTRAINT \`FK_e89aae80e010c2faa72e6a49ce8\` FOREIGN KEY (\`user_id\`) REFERENCES \`users\`(\`id\`) ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
  }

  public async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(
      `ALTER TABLE \`project_members\` DROP FOREIGN KEY \`FK_e89aae80e010c2faa72e6a49ce8\``,
    );
    await queryRunner.query(
      `ALTER TABLE \`project_members\` DROP FOREIGN KEY \`FK_b5729113570c20c7e214cf3f58d\``,
    );
    await queryRunner.query(`ALTER TABLE \`headings\` DROP FOREIGN KEY \`FK_4e52356a24e5d0e92d21d4a1a7f\``);
    await queryRunner.query(`DROP INDEX \`UQ_project_members_project_user\` ON \`project_members\``);
    await queryRunner.query(`DROP TABLE \`project_members\``);
    await queryRunner.query(`DROP INDEX \`IDX_97672ac88f789774dd47f7c8be\` ON \`users\``);
    await queryRunner.query(`DROP TABLE \`users\``);
    await queryRunner.query(`DROP INDEX \`UQ_headings_project_code\` ON \`headings\``);
    await queryRunner.query(`DROP TABLE \`headings\``);
    await queryRunner.query(`DROP INDEX \`IDX_d95a87318392465ab663a32cc4\` ON \`projects\``);
    await queryRunner.query(`DROP TABLE \`projects\``);
    await queryRunner.query(`DROP INDEX \`IDX_audit_events_project_at\` ON \`audit_events\``);
    await queryRunner.query(`DROP TABLE \`audit_events\``);
  }
}
