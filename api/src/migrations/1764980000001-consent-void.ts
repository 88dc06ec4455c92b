import type { MigrationInterface, QueryRunner } from 'typeorm';

// A consent record made in error can be voided (once): when, by whom, why, and what that deleted.
// A voided record is kept (struck through in the list) and no longer counts as consent.
export class ConsentVoid1764980000001 implements MigrationInterface {
  name = 'ConsentVoid1764980000001';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`
      ALTER TABLE "consents"
        ADD COLUMN "voided_at" timestamptz,
        ADD COLUMN "voided_by_id" uuid,
        ADD COLUMN "void_reason" text,
        ADD COLUMN "void_report" jsonb,
        ADD CONSTRAINT "FK_consents_voided_by_id" FOREIGN KEY ("voided_by_id") REFERENCES "users" ("id") ON DELETE RESTRICT,
        ADD CONSTRAINT "CHK_consents_void_complete"
          CHECK ((voided_at IS NULL) = (void_reason IS NULL) AND (voided_at IS NULL) = (void_report IS NULL)),
        ADD CONSTRAINT "CHK_consents_void_or_withdrawal" CHECK (voided_at IS NULL OR withdrawn_at IS NULL)`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`
      ALTER TABLE "consents"
        DROP CONSTRAINT "CHK_consents_void_or_withdrawal",
        DROP CONSTRAINT "CHK_consents_void_complete",
        DROP CONSTRAINT "FK_consents_voided_by_id",
        DROP COLUMN "void_report",
        DROP COLUMN "void_reason",
        DROP COLUMN "voided_by_id",
        DROP COLUMN "voided_at"`);
  }
}
