import type { MigrationInterface, QueryRunner } from 'typeorm';

// A summary starts as a draft the clinician edits (its text, subject, the versions and the staff
// comments ticked one by one, the recipients) and is sent when they say so. Summaries made before
// drafts existed were sent at once: they become 'sent'.
export class SummaryDrafts1765000000002 implements MigrationInterface {
  name = 'SummaryDrafts1765000000002';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`
      ALTER TABLE "summaries"
        ADD COLUMN "state" text NOT NULL DEFAULT 'sent',
        ADD COLUMN "contact_ids" jsonb NOT NULL DEFAULT '[]',
        ADD COLUMN "include_comments" jsonb NOT NULL DEFAULT '[]',
        ADD COLUMN "generated_text" text,
        ADD COLUMN "notes" jsonb NOT NULL DEFAULT '[]',
        ADD COLUMN "sent_at" timestamptz,
        ADD COLUMN "sent_by_id" uuid,
        ADD CONSTRAINT "FK_summaries_sent_by_id" FOREIGN KEY ("sent_by_id") REFERENCES "users" ("id") ON DELETE SET NULL,
        ADD CONSTRAINT "CHK_summaries_state" CHECK (state IN ('draft', 'sent'))`);
    // Existing summaries were sent when they were made.
    await q.query(`UPDATE "summaries" SET "sent_at" = "created_at", "sent_by_id" = "created_by_id"`);
    await q.query(`ALTER TABLE "summaries" ALTER COLUMN "state" SET DEFAULT 'draft'`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DELETE FROM "summaries" WHERE "state" = 'draft'`);
    await q.query(`
      ALTER TABLE "summaries"
        DROP CONSTRAINT "CHK_summaries_state",
        DROP CONSTRAINT "FK_summaries_sent_by_id",
        DROP COLUMN "sent_by_id",
        DROP COLUMN "sent_at",
        DROP COLUMN "notes",
        DROP COLUMN "generated_text",
        DROP COLUMN "include_comments",
        DROP COLUMN "contact_ids",
        DROP COLUMN "state"`);
  }
}
