import type { MigrationInterface, QueryRunner } from 'typeorm';

// What the family calls the client, for progress e-mails to them (the app keeps the pseudonym).
export class ClientPreferredName1765010000002 implements MigrationInterface {
  name = 'ClientPreferredName1765010000002';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE "clients" ADD COLUMN "preferred_name" text NULL`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE "clients" DROP COLUMN "preferred_name"`);
  }
}
