import type { MigrationInterface, QueryRunner } from 'typeorm';

// Idempotency keys of state-changing requests (sending a summary, sending it again): one row per
// (user, key), pending while the first request runs, then done with the id of what it made. They go
// with their user (ON DELETE CASCADE); rows older than a day are removed by the service.
export class CreateIdempotencyKeys1764930000001 implements MigrationInterface {
  name = 'CreateIdempotencyKeys1764930000001';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`
      CREATE TABLE "idempotency_keys" (
        "id" uuid NOT NULL DEFAULT gen_random_uuid(),
        "user_id" uuid NOT NULL,
        "key" text NOT NULL,
        "fingerprint" text NOT NULL,
        "status" text NOT NULL DEFAULT 'pending',
        "resource_id" uuid,
        "created_at" timestamptz NOT NULL DEFAULT now(),
        "completed_at" timestamptz,
        CONSTRAINT "PK_idempotency_keys" PRIMARY KEY ("id"),
        CONSTRAINT "UQ_idempotency_keys_user_key" UNIQUE ("user_id", "key"),
        CONSTRAINT "CHK_idempotency_keys_status" CHECK (status IN ('pending', 'done')),
        CONSTRAINT "FK_idempotency_keys_user_id" FOREIGN KEY ("user_id") REFERENCES "users" ("id") ON DELETE CASCADE
      )`);
    await q.query(`CREATE INDEX "IDX_idempotency_keys_created_at" ON "idempotency_keys" ("created_at")`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP TABLE "idempotency_keys"`);
  }
}
