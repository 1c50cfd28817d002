import type { MigrationInterface, QueryRunner } from 'typeorm';

// Written by hand as ADD COLUMN: the generated form rebuilds the users table, and dropping it with
// foreign keys on would null every campaign's lead.
export class AddUserPreferences1796147746489 implements MigrationInterface {
  name = 'AddUserPreferences1796147746489';

  async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`ALTER TABLE "users" ADD COLUMN "preferences" text NOT NULL DEFAULT ('{}')`);
  }

  async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`ALTER TABLE "users" DROP COLUMN "preferences"`);
  }
}
