import type { Trial } from '@keyloom/shared';
import { randomUUID } from 'node:crypto';
import { OneNamePerIdea1764950000002, USER_COLUMNS } from '../src/migrations/1764950000002-one-name-per-idea';
import { type Cast, newCast, newClient, send } from './caseload-helpers';
import { directSettings } from './trial-helpers';
import { createTestApp, resetDatabase, type TestApp } from './test-app';

// The renaming migration on a database that holds data: down restores the old names with the values
// in them, up again brings the new names back with the same values, and the API reads the result.
describe('migration OneNamePerIdea1764950000002 (up and down with data)', () => {
  let t: TestApp;
  let cast: Cast;
  let clientId: string;
  let versionId: string;
  const localTrialId = randomUUID();

  const columnsOf = async (table: string) =>
    (
      await t.dataSource.query<{ column_name: string }[]>(
        `SELECT column_name FROM information_schema.columns WHERE table_name = $1`,
        [table],
      )
    ).map((row) => row.column_name);

  const constraintsOf = async (table: string) =>
    (
      await t.dataSource.query<{ conname: string }[]>(
        `SELECT conname FROM pg_constraint WHERE conrelid = $1::regclass`,
        [table],
      )
    ).map((row) => row.conname);

  const run = async (direction: 'up' | 'down') => {
    const runner = t.dataSource.createQueryRunner();
    try {
      await runner.startTransaction();
      await new OneNamePerIdea1764950000002()[direction](runner);
      await runner.commitTransaction();
    } catch (error) {
      await runner.rollbackTransaction();
      throw error;
    } finally {
      await runner.release();
    }
  };

  beforeAll(async () => {
    await resetDatabase();
    t = await createTestApp();
    cast = await newCast(t.http, t.dataSource);
    clientId = (await newClient(t.http, cast.owner, cast.assignedCarer, 'R. Ashdown')).id;
    // A version as the API stores it, with a user in each of its user columns (only the columns read here matter).
    versionId = (
      await t.dataSource.query<{ id: string }[]>(
        `INSERT INTO profile_versions (client_id, number, status, settings, samples,
                                       created_by_id, signed_off_by_id, approved_by_id)
         VALUES ($1, 1, 'active', '{}', '[]', $2, $3, $2) RETURNING id`,
        [clientId, cast.owner.id, cast.assignedCarer.id],
      )
    )[0].id;
    await t.dataSource.query(
      `INSERT INTO practice_phrases (client_id, text, added_by_id) VALUES ($1, $2, $3)`,
      [clientId, 'pass the salt please', cast.owner.id],
    );
    await t.dataSource.query(
      `INSERT INTO trials (local_trial_id, profile_version_id, client_id, user_name, user_role,
                           started_at, finished_at, text, settings, events, measures, simulated)
       VALUES ($1, $2, $3, 'Hannah', 'carer', now() - interval '1 minute', now(), 'hi',
               $4, '[]', '{}', '{"keystrokeSavings": null, "wpm": null, "slots": 3}')`,
      [localTrialId, versionId, clientId, JSON.stringify({ ...directSettings, selectionMode: 'scanning' })],
    );
  });
  afterAll(async () => {
    await t.app.close();
  });

  it('down: the old column and constraint names come back, holding the same values', async () => {
    await run('down');

    const [version] = await t.dataSource.query<
      { created_by: string; signed_off_by: string; approved_by: string }[]
    >(`SELECT created_by, signed_off_by, approved_by FROM profile_versions WHERE id = $1`, [versionId]);
    expect(version).toEqual({
      created_by: cast.owner.id,
      signed_off_by: cast.assignedCarer.id,
      approved_by: cast.owner.id,
    });
    const [phrase] = await t.dataSource.query<{ added_by: string }[]>(
      `SELECT added_by FROM practice_phrases WHERE client_id = $1`,
      [clientId],
    );
    expect(phrase.added_by).toBe(cast.owner.id);
    const [trial] = await t.dataSource.query<
      { client_trial_id: string; settings: Record<string, unknown> }[]
    >(`SELECT client_trial_id, settings FROM trials WHERE profile_version_id = $1`, [versionId]);
    expect(trial.client_trial_id).toBe(localTrialId);
    expect(trial.settings).toMatchObject({ method: 'scanning', slots: directSettings.slots });
    expect(trial.settings).not.toHaveProperty('selectionMode');

    for (const [table, column] of USER_COLUMNS) {
      expect(await columnsOf(table)).toContain(column);
      expect(await columnsOf(table)).not.toContain(`${column}_id`);
      expect(await constraintsOf(table)).toContain(`FK_${table}_${column}`);
    }
    expect(await constraintsOf('trials')).toContain('UQ_trials_client_trial_id');
    // consents.given_by is not a user column and keeps its name either way.
    expect(await columnsOf('consents')).toContain('given_by');
  });

  it('up again: the new names hold the values, and the API reads the trial with them', async () => {
    await run('up');

    for (const [table, column] of USER_COLUMNS) {
      expect(await columnsOf(table)).toContain(`${column}_id`);
      expect(await columnsOf(table)).not.toContain(column);
      expect(await constraintsOf(table)).toContain(`FK_${table}_${column}_id`);
    }
    expect(await constraintsOf('trials')).toContain('UQ_trials_local_trial_id');
    expect(await columnsOf('consents')).toContain('given_by');
    // No uuid column ending in "_by" is left anywhere (every user-pointing one ends in "_by_id").
    const leftOver = await t.dataSource.query<{ table_name: string; column_name: string }[]>(
      `SELECT table_name, column_name FROM information_schema.columns
       WHERE table_schema = 'public' AND data_type = 'uuid' AND column_name LIKE '%\\_by'`,
    );
    expect(leftOver).toEqual([]);
    const [version] = await t.dataSource.query<{ signed_off_by_id: string }[]>(
      `SELECT signed_off_by_id FROM profile_versions WHERE id = $1`,
      [versionId],
    );
    expect(version.signed_off_by_id).toBe(cast.assignedCarer.id);

    const res = await send(t.http, cast.owner, 'get', `/api/profile-versions/${versionId}/trials`).expect(
      200,
    );
    const [trial] = res.body as Trial[];
    expect(trial.localTrialId).toBe(localTrialId);
    expect(trial.settings.selectionMode).toBe('scanning');
    expect(trial.settings).not.toHaveProperty('method');
  });

  it('leaves the entities and the migrated schema in agreement (no pending schema change)', async () => {
    const pending = await t.dataSource.driver.createSchemaBuilder().log();
    expect(pending.upQueries.map((query) => query.query)).toEqual([]);
  });
});
