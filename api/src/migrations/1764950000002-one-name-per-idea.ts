import type { MigrationInterface, QueryRunner } from 'typeorm';

// One name per idea. Nothing a user sees changes; only the stored names do.
//
// Old → new:
//   trials.client_trial_id (API field clientTrialId)          → trials.local_trial_id (localTrialId)
//     constraint UQ_trials_client_trial_id                    → UQ_trials_local_trial_id
//   trials.settings->'method' (API field settings.method)     → trials.settings->'selectionMode'
//     (how keys are selected on the test keyboard: direct, dwell or scanning; "access method"
//     stays the client record's body/device route)
//   profile_versions.created_by, FK_profile_versions_created_by       → created_by_id, FK_…_created_by_id
//   profile_versions.signed_off_by, FK_profile_versions_signed_off_by → signed_off_by_id, FK_…_signed_off_by_id
//   profile_versions.approved_by, FK_profile_versions_approved_by     → approved_by_id, FK_…_approved_by_id
//   summaries.created_by, FK_summaries_created_by                     → created_by_id, FK_summaries_created_by_id
//   practice_phrases.added_by, FK_practice_phrases_added_by           → added_by_id, FK_practice_phrases_added_by_id
//   language_samples.uploaded_by, FK_language_samples_uploaded_by     → uploaded_by_id, FK_…_uploaded_by_id
//   sample_flags.decided_by, FK_sample_flags_decided_by               → decided_by_id, FK_sample_flags_decided_by_id
//   (outside the database: env CLIENT_DIST → WEB_APP_DIST, still read as a fallback;
//   api/src/client/serve-client.ts serveClient → api/src/web-app/serve-web-app.ts serveWebApp;
//   AppConfig.clientDist → webAppDist; trialAccessMethods → trialSelectionModes)
//
// consents.given_by keeps its name: it is not a foreign key but says who gave consent ('client' or
// 'representative'), so "_by_id" would be wrong for it.
//
// Audit events are append-only and are left as they are: trial.create rows written before this
// migration keep the detail keys clientTrialId and method; new rows write localTrialId and
// selectionMode. The audit log shows every detail key it finds, so both read the same way.
const TRIAL_ID: [string, string] = ['client_trial_id', 'local_trial_id'];
/** The user-pointing foreign key columns given the `_id` ending, by table. */
export const USER_COLUMNS: readonly [table: string, column: string][] = [
  ['profile_versions', 'created_by'],
  ['profile_versions', 'signed_off_by'],
  ['profile_versions', 'approved_by'],
  ['summaries', 'created_by'],
  ['practice_phrases', 'added_by'],
  ['language_samples', 'uploaded_by'],
  ['sample_flags', 'decided_by'],
];

export class OneNamePerIdea1764950000002 implements MigrationInterface {
  name = 'OneNamePerIdea1764950000002';

  async up(q: QueryRunner): Promise<void> {
    await renameTrialId(q, TRIAL_ID[0], TRIAL_ID[1]);
    await renameSettingsKey(q, 'method', 'selectionMode');
    for (const [table, column] of USER_COLUMNS) await renameColumn(q, table, column, `${column}_id`);
  }

  async down(q: QueryRunner): Promise<void> {
    for (const [table, column] of USER_COLUMNS) await renameColumn(q, table, `${column}_id`, column);
    await renameSettingsKey(q, 'selectionMode', 'method');
    await renameTrialId(q, TRIAL_ID[1], TRIAL_ID[0]);
  }
}

// A user-pointing foreign key column and its constraint (FK_<table>_<column>).
async function renameColumn(q: QueryRunner, table: string, from: string, to: string) {
  await q.query(`ALTER TABLE "${table}" RENAME COLUMN "${from}" TO "${to}"`);
  await q.query(`ALTER TABLE "${table}" RENAME CONSTRAINT "FK_${table}_${from}" TO "FK_${table}_${to}"`);
}

async function renameTrialId(q: QueryRunner, from: string, to: string) {
  await q.query(`ALTER TABLE "trials" RENAME COLUMN "${from}" TO "${to}"`);
  // Renaming a unique constraint renames its index too (PostgreSQL documentation, ALTER TABLE).
  await q.query(`ALTER TABLE "trials" RENAME CONSTRAINT "UQ_trials_${from}" TO "UQ_trials_${to}"`);
}

async function renameSettingsKey(q: QueryRunner, from: string, to: string) {
  await q.query(
    `UPDATE "trials" SET "settings" = ("settings" - $1::text) || jsonb_build_object($2::text, "settings" -> $1::text)
     WHERE "settings" ? $1::text`,
    [from, to],
  );
}
