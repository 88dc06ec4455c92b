import {
  builtInPracticePhrases,
  type PracticePhrase,
  type Trial,
  trialSchema,
  type TrialSettings,
} from '@keyloom/shared';
import { VERSION_1_ID } from '@/features/profiles/testing/profile-data';
import { ASHBY_ID } from '@/testing/data';

// Invented trials of the Willowmere demo client's version 1 (the pages only show what the API sends).

/** Settings of a direct-access trial on the typewriter layout with 5 slots, nothing else switched on. */
export const directTrialSettings: TrialSettings = {
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

export const TRIAL_1_ID = 'e1f2a3b4-c5d6-4e7f-8a9b-0c1d2e3f4a71';
export const OWN_PHRASE_ID = 'f1e2d3c4-b5a6-4978-8695-a4b3c2d1e081';

export const trialRecord = (overrides: Partial<Trial> = {}): Trial =>
  trialSchema.parse({
    id: TRIAL_1_ID,
    localTrialId: '0b1c2d3e-4f5a-4b6c-8d7e-9f0a1b2c3d91',
    versionId: VERSION_1_ID,
    versionNumber: 1,
    clientId: ASHBY_ID,
    by: { id: 'a3e5f7b9-2c4d-4e6f-9a8b-4c5d6e7f8a04', name: 'Hannah Ashby', role: 'carer' },
    startedAt: '2026-09-25T18:00:00.000Z',
    finishedAt: '2026-09-25T18:02:00.000Z',
    phraseId: 'kl-11',
    targetPhrase: 'the soup is too hot',
    text: 'the soup is too hot ',
    settings: directTrialSettings,
    note: '',
    measures: {
      characters: 20,
      keystrokes: 12,
      switchActivations: 0,
      suggestionsOffered: 9,
      suggestionsTaken: 4,
      charactersFromSuggestions: 12,
      errorsCorrected: 1,
      durationMs: 95_000,
      keystrokeSavings: 0.4,
      kspc: 0.6,
      wpm: 2.4,
      errorRate: 0,
    },
    simulated: { keystrokeSavings: 0.367, wpm: 7.4, slots: 5 },
    createdAt: '2026-09-25T18:02:01.000Z',
    ...overrides,
  });

/** The API's practice phrases: Keyloom's own, then one of the client's (invented). */
export const practicePhrases = (): PracticePhrase[] => [
  ...builtInPracticePhrases,
  {
    id: OWN_PHRASE_ID,
    text: 'pepper wants her walk by the harbour',
    source: 'client',
    addedBy: 'Dr. Tomasz Reyes',
    createdAt: '2026-09-20T10:00:00.000Z',
  },
];
