import type { MigrationInterface, QueryRunner } from 'typeorm';

// The clinic's own details, named in progress e-mails and on the stop page: one row at most (id 1).
export class CreateClinicSettings1765010000001 implements MigrationInterface {
  name = 'CreateClinicSettings1765010000001';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`
      CREATE TABLE "clinic_settings" (
        "id" smallint NOT NULL DEFAULT 1,
        "name" text NOT NULL,
        "phone" text NOT NULL,
        "address" text NOT NULL,
        "email" text,
        "website" text,
        "updated_at" timestamptz NOT NULL DEFAULT now(),
        "updated_by_id" uuid,
        CONSTRAINT "PK_clinic_settings" PRIMARY KEY ("id"),
        CONSTRAINT "CHK_clinic_settings_single_row" CHECK (id = 1),
        CONSTRAINT "FK_clinic_settings_updated_by_id" FOREIGN KEY ("updated_by_id")
          REFERENCES "users"("id") ON DELETE SET NULL
      )`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP TABLE "clinic_settings"`);
  }
}
