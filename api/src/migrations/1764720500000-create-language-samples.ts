import type { MigrationInterface, QueryRunner } from 'typeorm';

// Language samples and their personal-data flags. Both go with their client (ON DELETE CASCADE);
// consent withdrawal deletes them through the 'samples' withdrawal hook.
export class CreateLanguageSamples1764720500000 implements MigrationInterface {
  name = 'CreateLanguageSamples1764720500000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`
      CREATE TABLE "language_samples" (
        "id" uuid NOT NULL DEFAULT gen_random_uuid(),
        "client_id" uuid NOT NULL,
        "title" text NOT NULL,
        "file_name" text,
        "source_kind" text NOT NULL,
        "period_start" date,
        "period_end" date,
        "note" text,
        "status" text NOT NULL,
        "excluded_reason" text,
        "encoding" text NOT NULL,
        "sha256" text NOT NULL,
        "byte_size" integer NOT NULL,
        "text" text NOT NULL,
        "characters" integer NOT NULL,
        "words" integer NOT NULL,
        "distinct_words" integer NOT NULL,
        "top_words" jsonb NOT NULL,
        "unknown_words" jsonb NOT NULL,
        "uploaded_by" uuid,
        "created_at" timestamptz NOT NULL DEFAULT now(),
        "updated_at" timestamptz NOT NULL DEFAULT now(),
        CONSTRAINT "PK_language_samples" PRIMARY KEY ("id"),
        CONSTRAINT "UQ_language_samples_client_sha256" UNIQUE ("client_id", "sha256"),
        CONSTRAINT "CHK_language_samples_source_kind" CHECK (source_kind IN ('messages', 'diary', 'email', 'transcript', 'other')),
        CONSTRAINT "CHK_language_samples_status" CHECK (status IN ('needs_review', 'ready', 'excluded')),
        CONSTRAINT "FK_language_samples_client_id" FOREIGN KEY ("client_id") REFERENCES "clients" ("id") ON DELETE CASCADE,
        CONSTRAINT "FK_language_samples_uploaded_by" FOREIGN KEY ("uploaded_by") REFERENCES "users" ("id") ON DELETE SET NULL
      )`);
    await q.query(`CREATE INDEX "IDX_language_samples_client_id" ON "language_samples" ("client_id")`);

    await q.query(`
      CREATE TABLE "sample_flags" (
        "id" uuid NOT NULL DEFAULT gen_random_uuid(),
        "sample_id" uuid NOT NULL,
        "kind" text NOT NULL,
        "start_offset" integer NOT NULL,
        "end_offset" integer NOT NULL,
        "text" text,
        "status" text NOT NULL,
        "reason" text,
        "decided_by" uuid,
        "decided_at" timestamptz,
        "created_at" timestamptz NOT NULL DEFAULT now(),
        CONSTRAINT "PK_sample_flags" PRIMARY KEY ("id"),
        CONSTRAINT "CHK_sample_flags_kind" CHECK (kind IN ('email', 'phone', 'street_address', 'postcode', 'date_of_birth', 'long_digits', 'url')),
        CONSTRAINT "CHK_sample_flags_status" CHECK (status IN ('open', 'redacted', 'kept')),
        CONSTRAINT "CHK_sample_flags_span" CHECK (start_offset >= 0 AND end_offset > start_offset),
        CONSTRAINT "FK_sample_flags_sample_id" FOREIGN KEY ("sample_id") REFERENCES "language_samples" ("id") ON DELETE CASCADE,
        CONSTRAINT "FK_sample_flags_decided_by" FOREIGN KEY ("decided_by") REFERENCES "users" ("id") ON DELETE SET NULL
      )`);
    await q.query(`CREATE INDEX "IDX_sample_flags_sample_id" ON "sample_flags" ("sample_id")`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP TABLE "sample_flags"`);
    await q.query(`DROP TABLE "language_samples"`);
  }
}
