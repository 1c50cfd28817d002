import type { MigrationInterface, QueryRunner } from 'typeorm';

export class AddRegistryViewIndexes1796148152276 implements MigrationInterface {
  name = 'AddRegistryViewIndexes1796148152276';

  async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`CREATE INDEX "idx_variants_campaign_status_fold_change" ON "variants" ("campaign_id", "status", "summary_fold_change", "summary_ddg_kj_per_mol") `);
    await queryRunner.query(`CREATE INDEX "idx_variants_campaign_status_ddg" ON "variants" ("campaign_id", "status", "summary_ddg_kj_per_mol", "summary_fold_change") `);
  }

  async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`DROP INDEX "idx_variants_campaign_status_ddg"`);
    await queryRunner.query(`DROP INDEX "idx_variants_campaign_status_fold_change"`);
  }
}
