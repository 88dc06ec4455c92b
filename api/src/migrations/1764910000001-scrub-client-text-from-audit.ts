import type { MigrationInterface, QueryRunner } from 'typeorm';
import { CLIENT_TEXT_KEYS } from '../audit/audit-details';

// Earlier versions copied free text about a client into audit details (practice phrase text, sign-off
// and approval comments, send-back reasons, sample and consent-form file names, contacts'
// relationships). This removes those keys from the events about a client, the one change to the
// append-only log that is allowed: the row trigger is switched off for this transaction only (ALTER
// TABLE … DISABLE TRIGGER is transactional in PostgreSQL, so a failure leaves it on). The fixed
// reason of withdrawal deletions ("consent withdrawn") becomes `cause`, as new events write it.
// Events without a client (sign-ins, staff accounts) keep their details. Cannot be undone.
export class ScrubClientTextFromAudit1764910000001 implements MigrationInterface {
  name = 'ScrubClientTextFromAudit1764910000001';

  async up(q: QueryRunner): Promise<void> {
    const keys = [...CLIENT_TEXT_KEYS];
    await q.query(`ALTER TABLE "audit_events" DISABLE TRIGGER "TRG_audit_events_no_update_delete"`);
    await q.query(
      `UPDATE "audit_events"
          SET "details" = ("details" - $1::text[])
            || CASE WHEN "details"->>'reason' = 'consent withdrawn'
                    THEN '{"cause": "consent-withdrawn"}'::jsonb ELSE '{}'::jsonb END
        WHERE "client_id" IS NOT NULL AND "details" ?| $1::text[]`,
      [keys],
    );
    await q.query(`ALTER TABLE "audit_events" ENABLE TRIGGER "TRG_audit_events_no_update_delete"`);
  }

  async down(): Promise<void> {
    // The removed text is gone on purpose; there is nothing to restore.
  }
}
