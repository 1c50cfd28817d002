import type { MigrationInterface, QueryRunner } from 'typeorm';

export class AddImports1796148927356 implements MigrationInterface {
  name = 'AddImports1796148927356';

  async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`CREATE TABLE "import_jobs" ("id" integer PRIMARY KEY AUTOINCREMENT NOT NULL, "kind" varchar(16) NOT NULL, "status" varchar(12) NOT NULL, "attachment_id" integer, "file_name" varchar(255) NOT NULL, "format" varchar(4) NOT NULL, "size_bytes" integer NOT NULL, "sheets" text NOT NULL, "sheet_name" varchar(200), "campaign_id" integer, "columns" text, "mode" varchar(16), "rows_processed" integer NOT NULL DEFAULT (0), "rows_total" integer NOT NULL DEFAULT (0), "new_rows" integer NOT NULL DEFAULT (0), "updated_rows" integer NOT NULL DEFAULT (0), "unchanged_rows" integer NOT NULL DEFAULT (0), "invalid_rows" integer NOT NULL DEFAULT (0), "problems" text NOT NULL, "seen_versions" text NOT NULL, "preview" text NOT NULL, "message" text, "created_by_id" integer, "finished_at" datetime, "version" integer NOT NULL, "created_at" datetime NOT NULL DEFAULT (datetime('now')), "updated_at" datetime NOT NULL DEFAULT (datetime('now')))`);
    await queryRunner.query(`CREATE INDEX "idx_import_jobs_creator_created" ON "import_jobs" ("created_by_id", "created_at") `);
    await queryRunner.query(`CREATE INDEX "idx_import_jobs_created" ON "import_jobs" ("created_at") `);
    await queryRunner.query(`CREATE TABLE "saved_column_mappings" ("id" integer PRIMARY KEY AUTOINCREMENT NOT NULL, "user_id" integer NOT NULL, "kind" varchar(16) NOT NULL, "mapping" text NOT NULL, "version" integer NOT NULL, "updated_at" datetime NOT NULL DEFAULT (datetime('now')))`);
    await queryRunner.query(`CREATE UNIQUE INDEX "idx_saved_column_mappings_user_kind" ON "saved_column_mappings" ("user_id", "kind") `);
  }

  async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`DROP INDEX "idx_saved_column_mappings_user_kind"`);
    await queryRunner.query(`DROP TABLE "saved_column_mappings"`);
    await queryRunner.query(`DROP INDEX "idx_import_jobs_created"`);
    await queryRunner.query(`DROP INDEX "idx_import_jobs_creator_created"`);
    await queryRunner.query(`DROP TABLE "import_jobs"`);
  }
}
