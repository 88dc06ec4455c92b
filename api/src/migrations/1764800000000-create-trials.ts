import type { MigrationInterface, QueryRunner } from 'typeorm';

// Test-keyboard trials: one row per finished trial of a profile version, with the log the
// API replayed and the measures it computed from it; and the practice phrases a clinician adds for a
// client. Both go with their client (and a trial with its version); a removed account leaves the
// record of who did it by name (SET NULL).
export class CreateTrials1764800000000 implements MigrationInterface {
  name = 'CreateTrials1764800000000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`
      CREATE TABLE "trials" (
        "id" uuid NOT NULL DEFAULT gen_random_uuid(),
        "client_trial_id" uuid NOT NULL,
        "profile_version_id" uuid NOT NULL,
        "client_id" uuid NOT NULL,
        "user_id" uuid,
        "user_name" text NOT NULL,
        "user_role" text NOT NULL,
        "started_at" timestamptz NOT NULL,
        "finished_at" timestamptz NOT NULL,
        "phrase_id" text,
        "target_phrase" text,
        "text" text NOT NULL,
        "settings" jsonb NOT NULL,
        "events" jsonb NOT NULL,
        "measures" jsonb NOT NULL,
        "simulated" jsonb NOT NULL,
        "note" text NOT NULL DEFAULT '',
        "created_at" timestamptz NOT NULL DEFAULT now(),
        CONSTRAINT "PK_trials" PRIMARY KEY ("id"),
        CONSTRAINT "UQ_trials_client_trial_id" UNIQUE ("client_trial_id"),
        CONSTRAINT "CHK_trials_times" CHECK (started_at <= finished_at),
        CONSTRAINT "FK_trials_profile_version_id" FOREIGN KEY ("profile_version_id") REFERENCES "profile_versions" ("id") ON DELETE CASCADE,
        CONSTRAINT "FK_trials_client_id" FOREIGN KEY ("client_id") REFERENCES "clients" ("id") ON DELETE CASCADE,
        CONSTRAINT "FK_trials_user_id" FOREIGN KEY ("user_id") REFERENCES "users" ("id") ON DELETE SET NULL
      )`);
    await q.query(
      `CREATE INDEX "IDX_trials_profile_version_id_created_at" ON "trials" ("profile_version_id", "created_at")`,
    );
    await q.query(`CREATE INDEX "IDX_trials_client_id" ON "trials" ("client_id")`);
    await q.query(`
      CREATE TABLE "practice_phrases" (
        "id" uuid NOT NULL DEFAULT gen_random_uuid(),
        "client_id" uuid NOT NULL,
        "text" text NOT NULL,
        "added_by" uuid,
        "created_at" timestamptz NOT NULL DEFAULT now(),
        CONSTRAINT "PK_practice_phrases" PRIMARY KEY ("id"),
        CONSTRAINT "FK_practice_phrases_client_id" FOREIGN KEY ("client_id") REFERENCES "clients" ("id") ON DELETE CASCADE,
        CONSTRAINT "FK_practice_phrases_added_by" FOREIGN KEY ("added_by") REFERENCES "users" ("id") ON DELETE SET NULL
      )`);
    await q.query(
      `CREATE UNIQUE INDEX "UQ_practice_phrases_client_text" ON "practice_phrases" ("client_id", lower("text"))`,
    );
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP TABLE "practice_phrases"`);
    await q.query(`DROP TABLE "trials"`);
  }
}
