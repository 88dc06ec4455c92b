import { profileSettingsSchema } from '@keyloom/shared';
import { randomUUID } from 'node:crypto';
import type { DataSource, EntityManager } from 'typeorm';
import { loadTrainingRuntime, runProfileTraining } from '../../profile-versions/profile-training';
import { ProfileVersion, type StoredVersionEvent } from '../../profile-versions/profile-version.entity';
import { accessFromClient, frozenSamples } from '../../profile-versions/profile-versions.service';
import { PracticePhraseRow } from '../../trials/practice-phrase.entity';
import { demoClinicianActor, findDemoClient } from './demo-client.seed';
import type { SeedStep } from './seed-step';

// Invented for the demo scenario (his dog Pepper and his sailing club).
export const DEMO_PRACTICE_PHRASE = 'can pepper come sailing with us on sunday?';

/**
 * The worker's job handler takes a DataSource; this one runs its queries and its save transaction
 * (a savepoint) inside the seed's transaction, which alone can see the version it just inserted.
 */
function inSeedTransaction(manager: EntityManager): DataSource {
  const view: DataSource = Object.create(manager.connection) as DataSource;
  Object.defineProperty(view, 'manager', { value: manager });
  Object.defineProperty(view, 'transaction', {
    value: (run: (tx: EntityManager) => Promise<unknown>) => manager.transaction(run),
  });
  return view;
}

/**
 * Version 1 of the demo client, trained (status `trained`, ready for trial) exactly as the worker
 * trains it: settings defaults with the client record's access, every ready sample frozen, the Brown
 * base model from corpora/.cache, PROFILE_FOLDS folds, and the worker's own job handler. Only when the
 * client has no version yet. Plus one practice phrase of his own.
 */
export const demoVersionStep: SeedStep = {
  name: 'demo version',
  async run({ manager, env, log }) {
    const client = await findDemoClient(manager);
    if (!client) {
      log('no demo client; skipped');
      return;
    }
    const { clinician, actor, audit } = await demoClinicianActor(manager);

    const phrases = manager.getRepository(PracticePhraseRow);
    if (!(await phrases.existsBy({ clientId: client.id }))) {
      const phrase = await phrases.save(
        phrases.create({ clientId: client.id, text: DEMO_PRACTICE_PHRASE, addedById: clinician.id }),
      );
      await audit.record(
        actor,
        'practice-phrase.create',
        { type: 'practice-phrase', id: phrase.id, clientId: client.id },
        { characters: DEMO_PRACTICE_PHRASE.length, by: 'seed' },
        manager,
      );
      log('added a practice phrase of his own');
    }

    if (await manager.getRepository(ProfileVersion).existsBy({ clientId: client.id })) {
      log('the demo client already has a version; kept');
      return;
    }
    const settings = profileSettingsSchema.parse({ access: accessFromClient(client) });
    const samples = await frozenSamples(manager, client.id, undefined);
    const jobId = randomUUID();
    const at = new Date().toISOString();
    const note = 'First version from the autumn samples (demo).';
    const history: StoredVersionEvent[] = [
      { status: 'draft', at, by: clinician.name, comment: note },
      { status: 'training', at, by: clinician.name, comment: null },
    ];
    const repo = manager.getRepository(ProfileVersion);
    const version = await repo.save(
      repo.create({
        clientId: client.id,
        number: 1,
        note,
        status: 'training',
        settings,
        samples,
        progress: 0,
        stage: 'queued',
        jobId,
        history,
        createdById: clinician.id,
      }),
    );
    const subject = { type: 'profile-version', id: version.id, clientId: client.id };
    const frozen = samples.map(({ id, sha256 }) => ({ id, sha256 }));
    await audit.record(
      actor,
      'profile.create',
      subject,
      { number: 1, settings, samples: frozen, by: 'seed' },
      manager,
    );
    await audit.record(actor, 'profile.train', subject, { jobId, retry: false, by: 'seed' }, manager);

    const started = Date.now();
    const runtime = loadTrainingRuntime(env.PROFILE_FOLDS);
    const outcome = await runProfileTraining(inSeedTransaction(manager), audit, version.id, jobId, runtime);
    if (outcome !== 'trained') throw new Error(`training the demo version ended ${outcome}`);
    const trained = await repo.findOneByOrFail({ id: version.id });
    log(
      `trained version 1 (${samples.length} samples, ${env.PROFILE_FOLDS} folds, model ${trained.modelSize} bytes) ` +
        `in ${Date.now() - started} ms`,
    );
  },
};
