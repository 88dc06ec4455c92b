import type { MigrationInterface, QueryRunner } from 'typeorm';

// Undoing a redaction: the redacted span's original text is kept on its flag only until a version
// starts training on the sample. A trigger drops it when a version moves to training (or trained),
// whichever process makes that move, so the text is never kept longer than the undo needs it.
export class SampleCorrections1764990000001 implements MigrationInterface {
  name = 'SampleCorrections1764990000001';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE "sample_flags" ADD COLUMN "original_text" text`);
    // OR REPLACE: TypeORM's dropDatabase (the tests' reset) drops tables and types, not functions.
    await q.query(`
      CREATE OR REPLACE FUNCTION "drop_redacted_originals"() RETURNS trigger LANGUAGE plpgsql AS $$
      BEGIN
        UPDATE sample_flags SET original_text = NULL
          WHERE original_text IS NOT NULL
            AND sample_id IN (SELECT (s->>'id')::uuid FROM jsonb_array_elements(NEW.samples) AS s);
        RETURN NULL;
      END
      $$`);
    await q.query(`
      CREATE TRIGGER "TRG_profile_versions_drop_redacted_originals"
        AFTER UPDATE OF status ON "profile_versions"
        FOR EACH ROW
        WHEN (OLD.status IS DISTINCT FROM NEW.status AND NEW.status IN ('training', 'trained'))
        EXECUTE FUNCTION "drop_redacted_originals"()`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP TRIGGER "TRG_profile_versions_drop_redacted_originals" ON "profile_versions"`);
    await q.query(`DROP FUNCTION "drop_redacted_originals"()`);
    await q.query(`ALTER TABLE "sample_flags" DROP COLUMN "original_text"`);
  }
}
