import type { MigrationInterface, QueryRunner } from 'typeorm';

// Values the installation makes for itself and keeps, by name: the key that signs exported profile
// files when EXPORT_SIGNING_KEY is not set (made on first use, never changed afterwards).
export class CreateAppSettings1764930000002 implements MigrationInterface {
  name = 'CreateAppSettings1764930000002';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`
      CREATE TABLE "app_settings" (
        "name" text NOT NULL,
        "value" text NOT NULL,
        "created_at" timestamptz NOT NULL DEFAULT now(),
        CONSTRAINT "PK_app_settings" PRIMARY KEY ("name")
      )`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP TABLE "app_settings"`);
  }
}
