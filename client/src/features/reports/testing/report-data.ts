import {
  type ClientReport,
  type ProfileReport,
  reportCautions,
  versionFigures,
  type VersionReport,
} from '@keyloom/shared';
import { reportFixture, VERSION_1_ID } from '@/features/profiles/testing/profile-data';
import { ASHBY_ID } from '@/testing/data';

// Invented for the Willowmere demo clinic. The figures are the shared versionFigures of the profiles
// feature's report fixture, so the view is checked against the words the API sends.

const chart = {
  svg: '<svg xmlns="http://www.w3.org/2000/svg" width="600" height="300"><rect width="600" height="300" fill="#fff"/></svg>',
  width: 600,
  height: 300,
  alt: 'Key presses saved, by number of suggestions, by suggestion slots: 1 slot: 21%; 2 slots: 30%.',
};

const letterhead = {
  clinic: { name: 'Willowmere Speech Clinic', address: '4 Orchard Row\nWillowmere', phone: '01632 960 418' },
  client: { id: ASHBY_ID, pseudonym: 'R. Ashby' },
  printedOn: '4 Dec 2026',
  cautions: [...reportCautions],
};

export const versionReportData = (overrides: Partial<VersionReport> = {}): VersionReport => ({
  ...letterhead,
  version: {
    id: VERSION_1_ID,
    number: 1,
    status: 'signed_off',
    statusLabel: 'Signed off by carer',
    createdBy: 'Dr. Tomasz Reyes',
    createdOn: '21 Sept 2026',
    trainedBy: 'Dr. Tomasz Reyes',
    trainedOn: '21 Sept 2026',
  },
  trail: [
    { step: 'Trained', by: 'Dr. Tomasz Reyes', on: '21 Sept 2026' },
    { step: 'Signed off by the carer', by: 'Maya Lindqvist', on: '24 Sept 2026' },
    { step: 'Approved by the supervisor', by: null, on: null },
  ],
  figures: versionFigures(
    reportFixture({
      hitRate: Object.fromEntries(Array.from({ length: 10 }, (_, i) => [String(i + 1), 0.4 + i * 0.03])),
    }) as unknown as ProfileReport,
  ),
  chart,
  trials: { count: 2, meanWpm: '3.4', notes: [] },
  samples: [
    { title: 'Sailing club diary', characters: 12_040 },
    { title: 'Messages to Hannah', characters: 1_210 },
  ],
  ...overrides,
});

export const clientReportData = (overrides: Partial<ClientReport> = {}): ClientReport => ({
  ...letterhead,
  period: { from: '2026-09-06', to: '2026-12-04', fromOn: '6 Sept 2026', toOn: '4 Dec 2026' },
  versions: [
    {
      id: VERSION_1_ID,
      number: 1,
      statusLabel: 'Active profile',
      trainedOn: '21 Sept 2026',
      approvedOn: '25 Sept 2026',
      slots: 3,
      keystrokeSavings: '38.0%',
      hitRate: '64% of words',
      wpm: '3.1 without suggestions, 4.2 with 3',
    },
  ],
  charts: [chart],
  trials: [{ versionNumber: 1, count: 3, meanWpm: '3.9', notes: [] }],
  ...overrides,
});
