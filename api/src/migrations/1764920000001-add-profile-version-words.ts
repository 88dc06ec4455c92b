import type { MigrationInterface, QueryRunner } from 'typeorm';

// The word-aware suggestion list of a trained version: the client's word model (WordNgramModel
// bytes), the mixture weights tuned for it, and the sha256 of the base vocabulary it was trained
// beside. Null on versions trained before the word-aware list (their files stay layout 1/2).
export class AddProfileVersionWords1764920000001 implements MigrationInterface {
  name = 'AddProfileVersionWords1764920000001';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`
      ALTER TABLE "profile_versions"
        ADD COLUMN "word_model" bytea,
        ADD COLUMN "word_weights" jsonb,
        ADD COLUMN "base_words_sha256" text`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`
      ALTER TABLE "profile_versions"
        DROP COLUMN "base_words_sha256",
        DROP COLUMN "word_weights",
        DROP COLUMN "word_model"`);
  }
}
