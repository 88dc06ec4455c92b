import type { SourceKind } from '@keyloom/shared';
import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { demoSamplesDir } from '../../config/data-paths';
import { loadLexiconWords } from '../../samples/lexicon.service';
import { SampleFlag } from '../../samples/sample-flag.entity';
import { countKinds, insertSample, prepareFile } from '../../samples/sample-ingest';
import { Sample } from '../../samples/sample.entity';
import { decideSampleFlag } from '../../samples/samples.service';
import { demoClinicianActor, findDemoClient } from './demo-client.seed';
import type { SeedStep } from './seed-step';

// corpora/demo, four levels above both api/src/db/seeds and api/dist/db/seeds.

type DemoFile = {
  file: string;
  sourceKind: SourceKind;
  periodStart: string;
  periodEnd: string;
  note: string | null;
  csvColumn?: string;
  // What the seed decides on this sample's flags; undefined leaves them open for the demo review.
  decide?: 'redact-all';
};

const DEMO_FILES: DemoFile[] = [
  {
    file: 'diary-september.txt',
    sourceKind: 'diary',
    periodStart: '2026-09-06',
    periodEnd: '2026-09-20',
    note: 'Typed with the head pointer.',
  },
  {
    file: 'diary-october.txt',
    sourceKind: 'diary',
    periodStart: '2026-10-03',
    periodEnd: '2026-10-15',
    note: null,
  },
  {
    file: 'diary-november.txt',
    sourceKind: 'diary',
    periodStart: '2026-11-02',
    periodEnd: '2026-11-23',
    note: null,
  },
  {
    file: 'messages-to-hannah.txt',
    sourceKind: 'messages',
    periodStart: '2026-09-01',
    periodEnd: '2026-10-20',
    note: 'Exported from his phone by Hannah.',
    decide: 'redact-all',
  },
  {
    file: 'sailing-club-messages.csv',
    sourceKind: 'messages',
    periodStart: '2026-09-05',
    periodEnd: '2026-10-16',
    note: 'Club group chat export; text column only.',
    csvColumn: 'text',
  },
  {
    file: 'email-to-club-secretary.txt',
    sourceKind: 'email',
    periodStart: '2026-10-20',
    periodEnd: '2026-10-20',
    note: null,
  },
  {
    file: 'transcript-speech-session.txt',
    sourceKind: 'transcript',
    periodStart: '2026-09-21',
    periodEnd: '2026-09-21',
    note: 'Conversation practice at the clinic.',
  },
];

/**
 * The demo client's language samples from corpora/demo, stored by the same code as uploads
 * (decoding, statistics, personal-data flags). Idempotent: a file whose bytes are already stored
 * for the client is skipped. The e-mail keeps its flags open for the review demo.
 */
export const demoSamplesStep: SeedStep = {
  name: 'demo samples',
  async run({ manager, log }) {
    const client = await findDemoClient(manager);
    if (!client) {
      log('no demo client; skipped');
      return;
    }
    const { clinician, actor, audit } = await demoClinicianActor(manager);
    let lexicon: Set<string> | null = null;
    const isKnownWord = (word: string) => (lexicon ??= loadLexiconWords().words).has(word);
    let added = 0;
    for (const demo of DEMO_FILES) {
      const bytes = readFileSync(resolve(demoSamplesDir, demo.file));
      const prepared = prepareFile({ originalname: demo.file, buffer: bytes }, demo.csvColumn, isKnownWord);
      if (await manager.getRepository(Sample).existsBy({ clientId: client.id, sha256: prepared.sha256 }))
        continue;
      const sample = await insertSample(manager, client.id, clinician.id, demo, prepared);
      await audit.record(
        actor,
        'sample.upload',
        { type: 'sample', id: sample.id, clientId: client.id },
        {
          sha256: prepared.sha256,
          byteSize: prepared.byteSize,
          flags: countKinds(prepared.matches),
          by: 'seed',
        },
        manager,
      );
      if (demo.decide === 'redact-all') {
        const flags = await manager.getRepository(SampleFlag).findBy({ sampleId: sample.id });
        for (const flag of flags) {
          await decideSampleFlag(
            manager,
            sample.id,
            flag.id,
            { action: 'redact', reason: null },
            clinician.id,
            isKnownWord,
          );
          await audit.record(
            actor,
            'sample.flag-redact',
            { type: 'sample', id: sample.id, clientId: client.id },
            { flagId: flag.id, kind: flag.kind, by: 'seed' },
            manager,
          );
        }
      }
      added++;
    }
    log(`${added} sample(s) added, ${DEMO_FILES.length - added} already present`);
  },
};
