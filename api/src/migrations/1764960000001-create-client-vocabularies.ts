import type { MigrationInterface, QueryRunner } from 'typeorm';

// A client's current vocabulary list (additions and blocks) and the spellings accepted as the
// client's own: what the next profile version freezes into its settings. One row per client, made
// by the first save; `revision` counts the saves (a save names the revision it changed).
export class CreateClientVocabularies1764960000001 implements MigrationInterface {
  name = 'CreateClientVocabularies1764960000001';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`
      CREATE TABLE "client_vocabularies" (
        "client_id" uuid NOT NULL,
        "revision" integer NOT NULL DEFAULT 0,
        "vocabulary" jsonb NOT NULL,
        "kept_spellings" jsonb NOT NULL,
        "updated_at" timestamptz NOT NULL,
        "updated_by_id" uuid,
        CONSTRAINT "PK_client_vocabularies" PRIMARY KEY ("client_id"),
        CONSTRAINT "CHK_client_vocabularies_revision" CHECK (revision >= 0),
        CONSTRAINT "FK_client_vocabularies_client_id" FOREIGN KEY ("client_id")
          REFERENCES "clients"("id") ON DELETE CASCADE,
        CONSTRAINT "FK_client_vocabularies_updated_by_id" FOREIGN KEY ("updated_by_id")
          REFERENCES "users"("id") ON DELETE SET NULL
      )`);
    await q.query(
      `CREATE INDEX "IDX_client_vocabularies_updated_by_id" ON "client_vocabularies" ("updated_by_id")`,
    );
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP TABLE "client_vocabularies"`);
  }
}
