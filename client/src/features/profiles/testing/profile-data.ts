import { defaultProfileSettings, type ProfileSettings, type ProfileVersion } from '@keyloom/shared';
import { ASHBY_ID, SAMPLE_ID } from '@/testing/data';

// Invented figures for the Willowmere demo client, in the shape of the engine's ProfileReport
// (shared/src/engine/profile/README.md). Not measurements: the tests only check that the pages show
// what the API sends. profile-report.test.ts checks the shape against a real engine report.

export const VERSION_1_ID = 'c1a2b3c4-d5e6-4f70-8a9b-0c1d2e3f4a01';
export const VERSION_2_ID = 'c1a2b3c4-d5e6-4f70-8a9b-0c1d2e3f4a02';

const perSlot = (values: readonly number[]): Record<string, number> =>
  Object.fromEntries(values.map((value, index) => [String(index + 1), value]));

/** The settings of the demo version (the schema's defaults, with the client's head pointer). */
const settingsFixture: ProfileSettings = {
  ...defaultProfileSettings,
  access: { method: 'head_pointer', keyTimeMs: 1800 },
};

export const reportFixture = (overrides: Record<string, unknown> = {}): Record<string, unknown> => ({
  engineVersion: 'keyloom-engine/1 (model layout 1, profile report 1)',
  chars: 24_180,
  documents: 6,
  settings: settingsFixture,
  order: 5,
  escape: 'C',
  adaptive: true,
  folds: 5,
  foldUnit: 'document',
  foldNote: '',
  heldOutChars: 24_180,
  bpcIdeal: 2.412,
  bpcIdealSpread: { min: 2.31, max: 2.55, std: 0.09 },
  bpcCoded: 2.419,
  bpcCodedSpread: { min: 2.318, max: 2.561, std: 0.091 },
  codedBytes: 7311,
  roundTrip: true,
  baseWeight: 0.35,
  baseWeightSpread: { min: 0.3, max: 0.4, std: 0.04 },
  keystrokeSavings: perSlot([0.214, 0.281, 0.322, 0.349, 0.367, 0.381, 0.392, 0.4, 0.407, 0.413]),
  kspc: perSlot([0.812, 0.744, 0.702, 0.675, 0.657, 0.643, 0.632, 0.624, 0.617, 0.611]),
  oracleSavings: 0.78,
  ksWords: 4836,
  hitRate: perSlot([0.41, 0.52, 0.58, 0.62, 0.65, 0.67, 0.69, 0.7, 0.71, 0.72]),
  // KSPC × characters ÷ words: the same keystrokes counted per word.
  selectionsPerWord: perSlot([4.06, 3.72, 3.51, 3.375, 3.285, 3.215, 3.16, 3.12, 3.085, 3.055]),
  ksSampleChars: 10_000,
  ksChars: 24_180,
  ksNote: 'Typed every held-out character.',
  scanStepsPerChar: { rowColumn: 6.8, modelOrdered: 3.9 },
  scanStepsByLayout: { typewriter: 7.42, alphabetical: 8.15, 'model-ordered': 5.37 },
  rates: {
    wpmWithout: 6.1,
    wpmWith: 7.4,
    msPerCharWithout: 1967,
    msPerCharWith: 1622,
    assumptions: {
      timing: { kind: 'direct', keyMs: 1800 },
      defaultTiming: false,
      scanStepsPerSelection: 0,
      msPerSelection: 1800,
      listReadMs: 500,
      slots: 5,
      kspc: 0.657,
      note: '',
    },
  },
  learningCurve: {
    fold: 0,
    heldOutChars: 4800,
    ksChars: 4800,
    slots: 5,
    points: [
      { fraction: 0.1, trainChars: 1938, baseWeight: 0.8, bpcIdeal: 3.02, keystrokeSavings: 0.29 },
      { fraction: 0.25, trainChars: 4845, baseWeight: 0.6, bpcIdeal: 2.78, keystrokeSavings: 0.32 },
      { fraction: 0.5, trainChars: 9690, baseWeight: 0.45, bpcIdeal: 2.6, keystrokeSavings: 0.345 },
      { fraction: 1, trainChars: 19_380, baseWeight: 0.35, bpcIdeal: 2.45, keystrokeSavings: 0.362 },
    ],
  },
  baseOnly: {
    bpcIdeal: 2.98,
    keystrokeSavings: perSlot([0.15, 0.2, 0.234, 0.256, 0.271, 0.283, 0.292, 0.299, 0.305, 0.31]),
    kspc: perSlot([0.871, 0.821, 0.788, 0.766, 0.751, 0.739, 0.73, 0.723, 0.717, 0.712]),
    hitRate: perSlot([0.3, 0.4, 0.46, 0.5, 0.53, 0.55, 0.57, 0.58, 0.59, 0.6]),
  },
  earlyWords: [
    { word: 'Pepper', count: 14 },
    { word: 'harbour', count: 9 },
    // Stored by engines before numbers and short words were left out: the pages leave them out.
    { word: '14', count: 5 },
    { word: 'I', count: 4 },
  ],
  perFold: [],
  timings: { preparing: 3, training: 40, 'cross-validating': 900, simulating: 1800, saving: 2, total: 2745 },
  ...overrides,
});

export const profileVersion = (overrides: Partial<ProfileVersion> = {}): ProfileVersion => ({
  id: VERSION_1_ID,
  clientId: ASHBY_ID,
  number: 1,
  note: null,
  status: 'trained',
  progress: 1,
  stage: 'saving',
  error: null,
  settings: settingsFixture,
  samples: [
    { id: SAMPLE_ID, title: 'Messages to the sailing club', sha256: 'a'.repeat(64), characters: 24_180 },
  ],
  baseOnly: false,
  metrics: reportFixture(),
  modelBytes: 81_920,
  createdBy: 'Dr. Tomasz Reyes',
  createdAt: '2026-09-21T09:00:00.000Z',
  trainedAt: '2026-09-21T09:01:00.000Z',
  history: [
    { status: 'draft', at: '2026-09-21T09:00:00.000Z', by: 'Dr. Tomasz Reyes', comment: null },
    { status: 'training', at: '2026-09-21T09:00:01.000Z', by: 'Dr. Tomasz Reyes', comment: null },
    { status: 'trained', at: '2026-09-21T09:01:00.000Z', by: null, comment: null },
  ],
  baseWeight: 0.35,
  baseModelSha256: 'b'.repeat(64),
  signedOffBy: null,
  signedOffAt: null,
  signOffComment: null,
  approvedBy: null,
  approvedAt: null,
  approvalComment: null,
  sentBackReason: null,
  retiredBy: null,
  retiredAt: null,
  retireReason: null,
  ...overrides,
});
