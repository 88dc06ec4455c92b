import type { CreateTrialInput, TrialEvent, TrialSettings } from '@keyloom/shared';
import { randomUUID } from 'node:crypto';
import type { Server } from 'node:http';
import type request from 'supertest';
import type { AuditService } from '../src/audit/audit.service';
import { runProfileTraining, type TrainingRuntime } from '../src/profile-versions/profile-training';
import { type Caller, send } from './caseload-helpers';
import type { TestApp } from './test-app';

/** Letter-by-letter steps typing `text`, evenly spread from 0 to `ms` (space → a space step). */
export function typedEvents(text: string, ms: number, from = 0): TrialEvent[] {
  const chars = [...text];
  return chars.map((c, i) => ({
    t: from + (chars.length > 1 ? Math.round((i * ms) / (chars.length - 1)) : 0),
    type: c === ' ' ? 'space' : /[\p{L}\p{N}]/u.test(c) ? 'letter' : 'punctuation',
    ...(c === ' ' ? {} : { value: c }),
  }));
}

export const directSettings: TrialSettings = {
  selectionMode: 'direct',
  layout: 'typewriter',
  slots: 5,
  dwellMs: null,
  scanIntervalMs: null,
  largeTargets: false,
  highContrast: false,
  textScale: 1,
  tintKeys: false,
};

/** A small valid trial body: "hi pepper" typed key by key in 4 s, new browser-made id. */
export function trialBody(overrides: Partial<CreateTrialInput> = {}): CreateTrialInput {
  const text = 'hi pepper';
  return {
    localTrialId: randomUUID(),
    startedAt: '2026-12-02T10:00:00.000Z',
    finishedAt: '2026-12-02T10:00:05.000Z',
    phraseId: null,
    targetPhrase: null,
    text,
    events: typedEvents(text, 4_000),
    settings: directSettings,
    note: '',
    ...overrides,
  };
}

/** POST /api/profile-versions/:id/trials as `who` (a trial is needed before sign-off). */
export function postTrial(
  http: Server,
  who: Caller,
  versionId: string,
  overrides: Partial<CreateTrialInput> = {},
): request.Test {
  return send(http, who, 'post', `/api/profile-versions/${versionId}/trials`, trialBody(overrides));
}

/**
 * POST train as `owner`, then runs the worker's job handler in-process; resolves to the handler's
 * outcome ('trained' when all went well).
 */
export async function trainInProcess(
  t: TestApp,
  audit: AuditService,
  owner: Caller,
  versionId: string,
  runtime: TrainingRuntime,
): Promise<string> {
  await send(t.http, owner, 'post', `/api/profile-versions/${versionId}/train`).expect(200);
  const rows: { job_id: string }[] = await t.dataSource.query(
    'SELECT job_id FROM profile_versions WHERE id = $1',
    [versionId],
  );
  return runProfileTraining(t.dataSource, audit, versionId, rows[0].job_id, runtime);
}
