import type { PracticePhrase, Trial as TrialShape } from '@keyloom/shared';
import type { PracticePhraseRow } from './practice-phrase.entity';
import type { Trial } from './trial.entity';

const REMOVED = '(removed account)';

/** Entity → trialSchema (the log is never sent back). */
export function toTrialDto(trial: Trial, versionNumber: number): TrialShape {
  return {
    id: trial.id,
    localTrialId: trial.localTrialId,
    versionId: trial.profileVersionId,
    versionNumber,
    clientId: trial.clientId,
    by: { id: trial.userId, name: trial.userName, role: trial.userRole },
    startedAt: trial.startedAt.toISOString(),
    finishedAt: trial.finishedAt.toISOString(),
    phraseId: trial.phraseId,
    targetPhrase: trial.targetPhrase,
    text: trial.text,
    settings: trial.settings,
    note: trial.note,
    measures: trial.measures,
    simulated: trial.simulated,
    createdAt: trial.createdAt.toISOString(),
  };
}

/** Entity (with addedBy loaded) → practicePhraseSchema, source 'client'. */
export function toPracticePhraseDto(row: PracticePhraseRow): PracticePhrase {
  return {
    id: row.id,
    text: row.text,
    source: 'client',
    addedBy: row.addedById ? (row.addedBy?.name ?? REMOVED) : null,
    createdAt: row.createdAt.toISOString(),
  };
}
