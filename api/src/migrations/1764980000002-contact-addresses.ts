import type { MigrationInterface, QueryRunner } from 'typeorm';

// Family contacts' addresses: one contact per address per client (case-insensitive), and a stop is
// kept per address (summary_stops), so it holds whatever contact carries the address later.
//
// Existing duplicates are not merged or changed: every contact but the oldest of each
// (client, lower(email)) group is marked legacy_duplicate_email, and the unique index leaves those
// rows out. The API refuses any new duplicate (it compares against all rows), and deleting the extra
// contacts clears the mark's purpose. Stops already used are copied to the address (the earliest
// time), and every contact carrying a stopped address is marked stopped too.
export class ContactAddresses1764980000002 implements MigrationInterface {
  name = 'ContactAddresses1764980000002';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`
      ALTER TABLE "family_contacts"
        ADD COLUMN "legacy_duplicate_email" boolean NOT NULL DEFAULT false,
        ADD COLUMN "summaries_consent_given_on" date,
        ADD COLUMN "summaries_consent_given_by" text`);
    await q.query(`
      UPDATE "family_contacts" AS c SET "legacy_duplicate_email" = true
      WHERE EXISTS (
        SELECT 1 FROM "family_contacts" AS o
        WHERE o.client_id = c.client_id AND lower(o.email) = lower(c.email)
          AND (o.created_at, o.id) < (c.created_at, c.id))`);
    await q.query(`
      CREATE UNIQUE INDEX "UQ_family_contacts_client_email" ON "family_contacts" ("client_id", lower("email"))
      WHERE NOT "legacy_duplicate_email"`);
    await q.query(`
      CREATE TABLE "summary_stops" (
        "client_id" uuid NOT NULL,
        "email_key" text NOT NULL,
        "stopped_at" timestamptz NOT NULL DEFAULT now(),
        CONSTRAINT "PK_summary_stops" PRIMARY KEY ("client_id", "email_key"),
        CONSTRAINT "CHK_summary_stops_email_key" CHECK (email_key = lower(email_key)),
        CONSTRAINT "FK_summary_stops_client_id" FOREIGN KEY ("client_id") REFERENCES "clients" ("id") ON DELETE CASCADE
      )`);
    await q.query(`
      INSERT INTO "summary_stops" ("client_id", "email_key", "stopped_at")
      SELECT client_id, lower(email), min(unsubscribed_at) FROM "family_contacts"
      WHERE unsubscribed_at IS NOT NULL GROUP BY client_id, lower(email)`);
    await q.query(`
      UPDATE "family_contacts" AS c SET "unsubscribed_at" = s.stopped_at
      FROM "summary_stops" AS s
      WHERE s.client_id = c.client_id AND s.email_key = lower(c.email) AND c.unsubscribed_at IS NULL`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP TABLE "summary_stops"`);
    await q.query(`DROP INDEX "UQ_family_contacts_client_email"`);
    await q.query(`
      ALTER TABLE "family_contacts"
        DROP COLUMN "summaries_consent_given_by",
        DROP COLUMN "summaries_consent_given_on",
        DROP COLUMN "legacy_duplicate_email"`);
  }
}
