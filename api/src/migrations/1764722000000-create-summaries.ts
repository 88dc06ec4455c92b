import type { MigrationInterface, QueryRunner } from 'typeorm';

// Progress summaries: what was sent (period, versions, note, content) and one row per
// recipient and send round with its idempotency key, delivery state and stop-link token. They go with
// their client (ON DELETE CASCADE); a deleted contact leaves the record of what was sent (SET NULL).
export class CreateSummaries1764722000000 implements MigrationInterface {
  name = 'CreateSummaries1764722000000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`
      CREATE TABLE "summaries" (
        "id" uuid NOT NULL DEFAULT gen_random_uuid(),
        "client_id" uuid NOT NULL,
        "period_from" date NOT NULL,
        "period_to" date NOT NULL,
        "version_ids" jsonb NOT NULL,
        "note" text NOT NULL,
        "subject" text NOT NULL,
        "text" text NOT NULL,
        "figures" jsonb NOT NULL,
        "created_by" uuid,
        "created_at" timestamptz NOT NULL DEFAULT now(),
        "updated_at" timestamptz NOT NULL DEFAULT now(),
        CONSTRAINT "PK_summaries" PRIMARY KEY ("id"),
        CONSTRAINT "CHK_summaries_period" CHECK (period_from <= period_to),
        CONSTRAINT "FK_summaries_client_id" FOREIGN KEY ("client_id") REFERENCES "clients" ("id") ON DELETE CASCADE,
        CONSTRAINT "FK_summaries_created_by" FOREIGN KEY ("created_by") REFERENCES "users" ("id") ON DELETE SET NULL
      )`);
    await q.query(`CREATE INDEX "IDX_summaries_client_id" ON "summaries" ("client_id")`);
    await q.query(`
      CREATE TABLE "summary_recipients" (
        "id" uuid NOT NULL DEFAULT gen_random_uuid(),
        "summary_id" uuid NOT NULL,
        "contact_id" uuid,
        "name" text NOT NULL,
        "email" text NOT NULL,
        "round" integer NOT NULL DEFAULT 1,
        "idempotency_key" uuid NOT NULL,
        "stop_token" text NOT NULL,
        "status" text NOT NULL DEFAULT 'queued',
        "attempts" integer NOT NULL DEFAULT 0,
        "last_error" text,
        "job_id" text,
        "message_id" text,
        "sent_at" timestamptz,
        "created_at" timestamptz NOT NULL DEFAULT now(),
        "updated_at" timestamptz NOT NULL DEFAULT now(),
        CONSTRAINT "PK_summary_recipients" PRIMARY KEY ("id"),
        CONSTRAINT "UQ_summary_recipients_idempotency_key" UNIQUE ("idempotency_key"),
        CONSTRAINT "UQ_summary_recipients_stop_token" UNIQUE ("stop_token"),
        CONSTRAINT "UQ_summary_recipients_round" UNIQUE ("summary_id", "contact_id", "round"),
        CONSTRAINT "CHK_summary_recipients_status" CHECK (status IN ('queued', 'sent', 'failed')),
        CONSTRAINT "CHK_summary_recipients_sent_at" CHECK ((status = 'sent') = (sent_at IS NOT NULL)),
        CONSTRAINT "FK_summary_recipients_summary_id" FOREIGN KEY ("summary_id") REFERENCES "summaries" ("id") ON DELETE CASCADE,
        CONSTRAINT "FK_summary_recipients_contact_id" FOREIGN KEY ("contact_id") REFERENCES "family_contacts" ("id") ON DELETE SET NULL
      )`);
    await q.query(`CREATE INDEX "IDX_summary_recipients_summary_id" ON "summary_recipients" ("summary_id")`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP TABLE "summary_recipients"`);
    await q.query(`DROP TABLE "summaries"`);
  }
}
