import type { MigrationInterface, QueryRunner } from 'typeorm';

// The audit log, append-only at the database level: a trigger raises on UPDATE, DELETE and TRUNCATE.
// (CREATE OR REPLACE: TypeORM's dropDatabase() in the tests drops tables, not functions.)
// One exception keeps the foreign key's ON DELETE SET NULL working: an update that only clears actor_id.
export class CreateAuditEvents1764633600001 implements MigrationInterface {
  name = 'CreateAuditEvents1764633600001';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`
      CREATE TABLE "audit_events" (
        "id" uuid NOT NULL DEFAULT gen_random_uuid(),
        "at" timestamptz NOT NULL DEFAULT now(),
        "actor_id" uuid,
        "actor_email" text,
        "action" text NOT NULL,
        "subject_type" text,
        "subject_id" text,
        "client_id" uuid,
        "details" jsonb NOT NULL DEFAULT '{}'::jsonb,
        "ip" text,
        CONSTRAINT "PK_audit_events" PRIMARY KEY ("id"),
        CONSTRAINT "FK_audit_events_actor_id" FOREIGN KEY ("actor_id") REFERENCES "users" ("id") ON DELETE SET NULL
      )`);
    await q.query(`CREATE INDEX "IDX_audit_events_at" ON "audit_events" ("at")`);
    await q.query(`CREATE INDEX "IDX_audit_events_actor_id" ON "audit_events" ("actor_id")`);
    await q.query(`CREATE INDEX "IDX_audit_events_subject" ON "audit_events" ("subject_type", "subject_id")`);
    await q.query(`CREATE INDEX "IDX_audit_events_client_id" ON "audit_events" ("client_id")`);

    await q.query(`
      CREATE OR REPLACE FUNCTION "audit_events_refuse_change"() RETURNS trigger LANGUAGE plpgsql AS $$
      BEGIN
        IF TG_OP = 'UPDATE' THEN
          IF OLD.actor_id IS NOT NULL AND NEW.actor_id IS NULL
             AND (to_jsonb(NEW) - 'actor_id') = (to_jsonb(OLD) - 'actor_id') THEN
            RETURN NEW;
          END IF;
        END IF;
        RAISE EXCEPTION 'audit_events is append-only: % is not allowed', TG_OP
          USING ERRCODE = 'insufficient_privilege';
      END
      $$`);
    await q.query(`
      CREATE TRIGGER "TRG_audit_events_no_update_delete"
      BEFORE UPDATE OR DELETE ON "audit_events"
      FOR EACH ROW EXECUTE FUNCTION "audit_events_refuse_change"()`);
    await q.query(`
      CREATE TRIGGER "TRG_audit_events_no_truncate"
      BEFORE TRUNCATE ON "audit_events"
      FOR EACH STATEMENT EXECUTE FUNCTION "audit_events_refuse_change"()`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP TABLE "audit_events"`);
    await q.query(`DROP FUNCTION "audit_events_refuse_change"()`);
  }
}
