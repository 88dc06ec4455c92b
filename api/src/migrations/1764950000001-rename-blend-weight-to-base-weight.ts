import type { MigrationInterface, QueryRunner } from 'typeorm';

// The base model's weight has one name everywhere (settings, report, API, file header): the
// column `blend_weight` becomes `base_weight`. A rename keeps every stored value.
export class RenameBlendWeightToBaseWeight1764950000001 implements MigrationInterface {
  name = 'RenameBlendWeightToBaseWeight1764950000001';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE "profile_versions" RENAME COLUMN "blend_weight" TO "base_weight"`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE "profile_versions" RENAME COLUMN "base_weight" TO "blend_weight"`);
  }
}
