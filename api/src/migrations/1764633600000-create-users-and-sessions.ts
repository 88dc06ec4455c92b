import type { MigrationInterface, QueryRunner } from 'typeorm';

// Staff accounts and the express-session store of connect-pg-simple (its table.sql, with our index name).
export class CreateUsersAndSessions1764633600000 implements MigrationInterface {
  name = 'CreateUsersAndSessions1764633600000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`
      CREATE TABLE "users" (
        "id" uuid NOT NULL DEFAULT gen_random_uuid(),
        "email" text NOT NULL,
        "name" text NOT NULL,
        "role" text NOT NULL,
        "password_hash" text NOT NULL,
        "active" boolean NOT NULL DEFAULT true,
        "created_at" timestamptz NOT NULL DEFAULT now(),
        "updated_at" timestamptz NOT NULL DEFAULT now(),
        "last_sign_in_at" timestamptz,
        CONSTRAINT "PK_users" PRIMARY KEY ("id"),
        CONSTRAINT "CHK_users_role" CHECK (role IN ('admin', 'clinician', 'supervisor', 'carer')),
        CONSTRAINT "CHK_users_email_trimmed" CHECK (email = btrim(email) AND email <> '')
      )`);
    await q.query(`CREATE UNIQUE INDEX "UQ_users_email_lower" ON "users" (lower("email"))`);
    await q.query(`CREATE INDEX "IDX_users_role_active" ON "users" ("role", "active")`);

    await q.query(`
      CREATE TABLE "session" (
        "sid" varchar NOT NULL COLLATE "default",
        "sess" json NOT NULL,
        "expire" timestamp(6) NOT NULL,
        CONSTRAINT "PK_session" PRIMARY KEY ("sid")
      )`);
    await q.query(`CREATE INDEX "IDX_session_expire" ON "session" ("expire")`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP TABLE "session"`);
    await q.query(`DROP TABLE "users"`);
  }
}
