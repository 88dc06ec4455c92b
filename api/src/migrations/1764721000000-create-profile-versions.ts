import type { MigrationInterface, QueryRunner } from 'typeorm';

// Profile versions: frozen settings and samples (with their text as it was when the
// version was configured), training state, the engine's report and the serialised personal model.
// They go with their client (ON DELETE CASCADE); consent withdrawal deletes them through the
// 'profileVersions' withdrawal hook.
export class CreateProfileVersions1764721000000 implements MigrationInterface {
  name = 'CreateProfileVersions1764721000000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`
      CREATE TABLE "profile_versions" (
        "id" uuid NOT NULL DEFAULT gen_random_uuid(),
        "client_id" uuid NOT NULL,
        "number" integer NOT NULL,
        "note" text,
        "status" text NOT NULL,
        "settings" jsonb NOT NULL,
        "samples" jsonb NOT NULL,
        "progress" double precision NOT NULL DEFAULT 0,
        "stage" text,
        "error" text,
        "job_id" text,
        "heartbeat_at" timestamptz,
        "metrics" jsonb,
        "model" bytea,
        "model_size" integer,
        "blend_weight" double precision,
        "base_model_sha256" text,
        "history" jsonb NOT NULL DEFAULT '[]',
        "created_by" uuid,
        "signed_off_by" uuid,
        "signed_off_at" timestamptz,
        "sign_off_comment" text,
        "approved_by" uuid,
        "approved_at" timestamptz,
        "approval_comment" text,
        "sent_back_reason" text,
        "created_at" timestamptz NOT NULL DEFAULT now(),
        "trained_at" timestamptz,
        "updated_at" timestamptz NOT NULL DEFAULT now(),
        CONSTRAINT "PK_profile_versions" PRIMARY KEY ("id"),
        CONSTRAINT "UQ_profile_versions_client_number" UNIQUE ("client_id", "number"),
        CONSTRAINT "CHK_profile_versions_status" CHECK (status IN ('draft', 'training', 'trained', 'failed', 'signed_off', 'active', 'retired', 'sent_back')),
        CONSTRAINT "CHK_profile_versions_progress" CHECK (progress >= 0 AND progress <= 1),
        CONSTRAINT "FK_profile_versions_client_id" FOREIGN KEY ("client_id") REFERENCES "clients" ("id") ON DELETE CASCADE,
        CONSTRAINT "FK_profile_versions_created_by" FOREIGN KEY ("created_by") REFERENCES "users" ("id") ON DELETE SET NULL,
        CONSTRAINT "FK_profile_versions_signed_off_by" FOREIGN KEY ("signed_off_by") REFERENCES "users" ("id") ON DELETE SET NULL,
        CONSTRAINT "FK_profile_versions_approved_by" FOREIGN KEY ("approved_by") REFERENCES "users" ("id") ON DELETE SET NULL
      )`);
    // At most one active version per client, enforced by the database as well as by the approval.
    await q.query(
      `CREATE UNIQUE INDEX "UQ_profile_versions_one_active" ON "profile_versions" ("client_id") WHERE status = 'active'`,
    );
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP TABLE "profile_versions"`);
  }
}
