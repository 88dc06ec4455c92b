import type { MigrationInterface, QueryRunner } from 'typeorm';

// Clients, carer assignments, consent records (with the scanned form as bytea) and family contacts.
// Consent records and contacts RESTRICT the deletion of their client: the paper trail stays.
export class CreateClientsAndConsents1764720000000 implements MigrationInterface {
  name = 'CreateClientsAndConsents1764720000000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`
      CREATE TABLE "clients" (
        "id" uuid NOT NULL DEFAULT gen_random_uuid(),
        "pseudonym" text NOT NULL,
        "access_method" text NOT NULL,
        "scan_interval_ms" integer,
        "dwell_ms" integer,
        "key_time_ms" integer,
        "goals" text,
        "notes" text,
        "clinician_id" uuid NOT NULL,
        "created_at" timestamptz NOT NULL DEFAULT now(),
        "updated_at" timestamptz NOT NULL DEFAULT now(),
        CONSTRAINT "PK_clients" PRIMARY KEY ("id"),
        CONSTRAINT "CHK_clients_access_method" CHECK (access_method IN ('direct', 'switch', 'eye_gaze', 'head_pointer', 'other')),
        CONSTRAINT "CHK_clients_pseudonym_trimmed" CHECK (pseudonym = btrim(pseudonym) AND pseudonym <> ''),
        CONSTRAINT "FK_clients_clinician_id" FOREIGN KEY ("clinician_id") REFERENCES "users" ("id") ON DELETE RESTRICT
      )`);
    await q.query(`CREATE INDEX "IDX_clients_clinician_id" ON "clients" ("clinician_id")`);

    await q.query(`
      CREATE TABLE "client_assignments" (
        "client_id" uuid NOT NULL,
        "user_id" uuid NOT NULL,
        "assigned_by_id" uuid,
        "assigned_at" timestamptz NOT NULL DEFAULT now(),
        CONSTRAINT "PK_client_assignments" PRIMARY KEY ("client_id", "user_id"),
        CONSTRAINT "FK_client_assignments_client_id" FOREIGN KEY ("client_id") REFERENCES "clients" ("id") ON DELETE CASCADE,
        CONSTRAINT "FK_client_assignments_user_id" FOREIGN KEY ("user_id") REFERENCES "users" ("id") ON DELETE CASCADE,
        CONSTRAINT "FK_client_assignments_assigned_by_id" FOREIGN KEY ("assigned_by_id") REFERENCES "users" ("id") ON DELETE SET NULL
      )`);
    await q.query(`CREATE INDEX "IDX_client_assignments_user_id" ON "client_assignments" ("user_id")`);

    await q.query(`
      CREATE TABLE "consents" (
        "id" uuid NOT NULL DEFAULT gen_random_uuid(),
        "client_id" uuid NOT NULL,
        "given_by" text NOT NULL,
        "representative_name" text,
        "representative_relationship" text,
        "scopes" text array NOT NULL,
        "given_on" date NOT NULL,
        "expires_on" date,
        "notes" text,
        "recorded_by_id" uuid NOT NULL,
        "created_at" timestamptz NOT NULL DEFAULT now(),
        "withdrawn_at" timestamptz,
        "withdrawn_by_id" uuid,
        "withdrawal_reason" text,
        "withdrawal" jsonb,
        "document_name" text,
        "document_mime" text,
        "document_size" integer,
        "document_bytes" bytea,
        "document_uploaded_at" timestamptz,
        CONSTRAINT "PK_consents" PRIMARY KEY ("id"),
        CONSTRAINT "CHK_consents_given_by" CHECK (given_by IN ('client', 'representative')),
        CONSTRAINT "CHK_consents_scopes" CHECK (cardinality(scopes) > 0 AND scopes <@ ARRAY['training', 'summaries']::text[]),
        CONSTRAINT "CHK_consents_expiry_after_given" CHECK (expires_on IS NULL OR expires_on > given_on),
        CONSTRAINT "CHK_consents_withdrawal_complete" CHECK ((withdrawn_at IS NULL) = (withdrawal IS NULL)),
        CONSTRAINT "FK_consents_client_id" FOREIGN KEY ("client_id") REFERENCES "clients" ("id") ON DELETE RESTRICT,
        CONSTRAINT "FK_consents_recorded_by_id" FOREIGN KEY ("recorded_by_id") REFERENCES "users" ("id") ON DELETE RESTRICT,
        CONSTRAINT "FK_consents_withdrawn_by_id" FOREIGN KEY ("withdrawn_by_id") REFERENCES "users" ("id") ON DELETE RESTRICT
      )`);
    await q.query(`CREATE INDEX "IDX_consents_client_id" ON "consents" ("client_id")`);

    await q.query(`
      CREATE TABLE "family_contacts" (
        "id" uuid NOT NULL DEFAULT gen_random_uuid(),
        "client_id" uuid NOT NULL,
        "name" text NOT NULL,
        "relationship" text NOT NULL,
        "email" text NOT NULL,
        "consent_to_summaries" boolean NOT NULL,
        "unsubscribed_at" timestamptz,
        "created_at" timestamptz NOT NULL DEFAULT now(),
        "updated_at" timestamptz NOT NULL DEFAULT now(),
        CONSTRAINT "PK_family_contacts" PRIMARY KEY ("id"),
        CONSTRAINT "FK_family_contacts_client_id" FOREIGN KEY ("client_id") REFERENCES "clients" ("id") ON DELETE RESTRICT
      )`);
    await q.query(`CREATE INDEX "IDX_family_contacts_client_id" ON "family_contacts" ("client_id")`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP TABLE "family_contacts"`);
    await q.query(`DROP TABLE "consents"`);
    await q.query(`DROP TABLE "client_assignments"`);
    await q.query(`DROP TABLE "clients"`);
  }
}
