import type { MigrationInterface, QueryRunner } from 'typeorm';

// Failed sign-in counters per account and per client address (shared by every API process), and the
// flag that makes an account choose a new password before anything else.
export class AddSignInLimitsAndPasswordChange1764940000001 implements MigrationInterface {
  name = 'AddSignInLimitsAndPasswordChange1764940000001';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE "users" ADD "must_change_password" boolean NOT NULL DEFAULT false`);
    await q.query(`
      CREATE TABLE "sign_in_limits" (
        "kind" text NOT NULL,
        "subject" text NOT NULL,
        "failures" integer NOT NULL DEFAULT 0,
        "window_started_at" timestamptz NOT NULL DEFAULT now(),
        "locked_until" timestamptz,
        "updated_at" timestamptz NOT NULL DEFAULT now(),
        CONSTRAINT "PK_sign_in_limits" PRIMARY KEY ("kind", "subject"),
        CONSTRAINT "CHK_sign_in_limits_kind" CHECK (kind IN ('account', 'address')),
        CONSTRAINT "CHK_sign_in_limits_failures" CHECK (failures >= 0)
      )`);
    await q.query(`CREATE INDEX "IDX_sign_in_limits_updated_at" ON "sign_in_limits" ("updated_at")`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP TABLE "sign_in_limits"`);
    await q.query(`ALTER TABLE "users" DROP COLUMN "must_change_password"`);
  }
}
