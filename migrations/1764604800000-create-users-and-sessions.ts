import type { MigrationInterface, QueryRunner } from 'typeorm';

export class CreateUsersAndSessions1764604800000 implements MigrationInterface {
  name = 'CreateUsersAndSessions1764604800000';

  async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`
      CREATE TABLE "users" (
        "id" integer PRIMARY KEY AUTOINCREMENT NOT NULL,
        "email" varchar(254) NOT NULL,
        "name" varchar(120) NOT NULL,
        "password_hash" varchar(255) NOT NULL,
        "role" varchar(20) NOT NULL,
        "active" boolean NOT NULL DEFAULT (1),
        "last_sign_in_at" datetime,
        "version" integer NOT NULL,
        "created_at" datetime NOT NULL DEFAULT (datetime('now')),
        "updated_at" datetime NOT NULL DEFAULT (datetime('now'))
      )`);
    await queryRunner.query(`CREATE UNIQUE INDEX "idx_users_email" ON "users" ("email")`);
    await queryRunner.query(`
      CREATE TABLE "sessions" (
        "sid" varchar(128) PRIMARY KEY NOT NULL,
        "data" text NOT NULL,
        "expires_at" integer NOT NULL,
        "user_id" integer
      )`);
    await queryRunner.query(`CREATE INDEX "idx_sessions_expires_at" ON "sessions" ("expires_at")`);
    await queryRunner.query(`CREATE INDEX "idx_sessions_user_id" ON "sessions" ("user_id")`);
  }

  async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`DROP TABLE "sessions"`);
    await queryRunner.query(`DROP TABLE "users"`);
  }
}
