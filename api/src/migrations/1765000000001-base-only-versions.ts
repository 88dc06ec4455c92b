import type { MigrationInterface, QueryRunner } from 'typeorm';

// A base-only profile version: general English alone, for a client with too little writing. It
// freezes no samples (the check keeps it that way).
export class BaseOnlyVersions1765000000001 implements MigrationInterface {
  name = 'BaseOnlyVersions1765000000001';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`
      ALTER TABLE "profile_versions"
        ADD COLUMN "base_only" boolean NOT NULL DEFAULT false,
        ADD CONSTRAINT "CHK_profile_versions_base_only_samples"
          CHECK (NOT base_only OR jsonb_array_length(samples) = 0)`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`
      ALTER TABLE "profile_versions"
        DROP CONSTRAINT "CHK_profile_versions_base_only_samples",
        DROP COLUMN "base_only"`);
  }
}
