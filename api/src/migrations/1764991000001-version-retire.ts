import type { MigrationInterface, QueryRunner } from 'typeorm';

// An active profile version can be retired by hand (once): when, by whom and why. A version retired
// this way is never made active again when a later version is retired; one retired because an
// approval replaced it (these columns null) can be.
export class VersionRetire1764991000001 implements MigrationInterface {
  name = 'VersionRetire1764991000001';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`
      ALTER TABLE "profile_versions"
        ADD COLUMN "retired_at" timestamptz,
        ADD COLUMN "retired_by_id" uuid,
        ADD COLUMN "retire_reason" text,
        ADD CONSTRAINT "FK_profile_versions_retired_by_id" FOREIGN KEY ("retired_by_id") REFERENCES "users" ("id") ON DELETE SET NULL,
        ADD CONSTRAINT "CHK_profile_versions_retire_complete"
          CHECK ((retired_at IS NULL) = (retire_reason IS NULL))`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`
      ALTER TABLE "profile_versions"
        DROP CONSTRAINT "CHK_profile_versions_retire_complete",
        DROP CONSTRAINT "FK_profile_versions_retired_by_id",
        DROP COLUMN "retire_reason",
        DROP COLUMN "retired_by_id",
        DROP COLUMN "retired_at"`);
  }
}
