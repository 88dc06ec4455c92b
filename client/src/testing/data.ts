import type {
  Role,
  SessionUser,
  User,
  AuditEventView,
  Client,
  ClientSummary,
  Consent,
  Contact,
  SampleDetail,
  SampleSummary,
} from '@keyloom/shared';

// The demo clinic's staff (foundation contract, "Demo accounts"); invented people.
const demoStaff: Record<Role, { id: string; name: string }> = {
  admin: { id: '2f0e7a52-5d0c-4c6e-9a51-0c1d5b7f9a01', name: 'Imogen Hale' },
  clinician: { id: '6b1c3d9e-8f2a-4b7c-9d1e-2a3b4c5d6e02', name: 'Dr. Tomasz Reyes' },
  supervisor: { id: '9c2d4e6f-1a3b-4c5d-8e7f-3b4c5d6e7f03', name: 'Priya Okonkwo' },
  carer: { id: 'a3e5f7b9-2c4d-4e6f-9a8b-4c5d6e7f8a04', name: 'Hannah Ashby' },
};

export const sessionUser = (role: Role): SessionUser => ({
  id: demoStaff[role].id,
  email: `${role}@willowmere.example`,
  name: demoStaff[role].name,
  role,
});

export const staffUser = (role: Role, overrides: Partial<User> = {}): User => ({
  ...sessionUser(role),
  active: true,
  createdAt: '2026-01-05T09:00:00.000Z',
  lastSignInAt: null,
  ...overrides,
});

// ---- Caseload fixtures, invented for the Willowmere demo ----------------------

export const ASHBY_ID = '5d1f3a7c-2b4e-4c6d-8e9f-0a1b2c3d4e51';

export const clientSummary = (overrides: Partial<ClientSummary> = {}): ClientSummary => ({
  id: ASHBY_ID,
  pseudonym: 'R. Ashby',
  accessMethod: 'head_pointer',
  clinician: { id: demoStaff.clinician.id, name: demoStaff.clinician.name },
  carers: [{ id: demoStaff.carer.id, name: demoStaff.carer.name }],
  consentStatus: 'active',
  trainingConsent: true,
  summariesConsent: true,
  sampleCount: 3,
  createdAt: '2026-09-14T09:00:00.000Z',
  updatedAt: '2026-09-20T10:30:00.000Z',
  ...overrides,
});

export const clientRecord = (overrides: Partial<Client> = {}): Client => ({
  ...clientSummary(),
  preferredName: 'Robbie',
  scanIntervalMs: null,
  dwellMs: null,
  keyTimeMs: 1800,
  goals: 'Write to his sailing club and his sister without help.',
  notes: 'Tires after about twenty minutes of typing.',
  ...overrides,
});

export const consentRecord = (overrides: Partial<Consent> = {}): Consent => ({
  id: '7a2b3c4d-5e6f-4a8b-9c0d-1e2f3a4b5c61',
  clientId: ASHBY_ID,
  givenBy: 'client',
  representativeName: null,
  representativeRelationship: null,
  scopes: ['training', 'summaries'],
  givenOn: '2026-09-14',
  expiresOn: null,
  notes: null,
  status: 'active',
  recordedBy: demoStaff.clinician.name,
  createdAt: '2026-09-14T09:10:00.000Z',
  withdrawnAt: null,
  withdrawnBy: null,
  withdrawalReason: null,
  withdrawal: null,
  voidedAt: null,
  voidedBy: null,
  voidReason: null,
  voidReport: null,
  document: null,
  ...overrides,
});

export const contactRecord = (overrides: Partial<Contact> = {}): Contact => ({
  id: '8b3c4d5e-6f7a-4b9c-8d1e-2f3a4b5c6d71',
  clientId: ASHBY_ID,
  name: 'Hannah Ashby',
  relationship: 'Sister',
  email: 'hannah.ashby@family.example',
  consentToSummaries: true,
  unsubscribedAt: null,
  summariesConsentGivenOn: null,
  summariesConsentGivenBy: null,
  createdAt: '2026-09-14T09:20:00.000Z',
  ...overrides,
});

export const SAMPLE_ID = '9c4d5e6f-7a8b-4c0d-9e2f-3a4b5c6d7e81';

export const sampleSummary = (overrides: Partial<SampleSummary> = {}): SampleSummary => ({
  id: SAMPLE_ID,
  clientId: ASHBY_ID,
  title: 'Messages to the sailing club',
  fileName: 'sailing-club.txt',
  sourceKind: 'messages',
  periodStart: '2026-08-01',
  periodEnd: '2026-08-31',
  note: null,
  status: 'needs_review',
  excludedReason: null,
  encoding: 'utf-8',
  sha256: 'a'.repeat(64),
  byteSize: 96,
  characters: 96,
  words: 18,
  distinctWords: 17,
  openFlags: 2,
  uploadedBy: demoStaff.clinician.name,
  createdAt: '2026-09-15T08:00:00.000Z',
  ...overrides,
});

// Offsets below are counted on this text by hand (the flags' spans).
export const sampleText =
  'Call me on 07700 900123 before the race. Pepper says hi. Write to rob@harbour.example after.';

export const sampleDetail = (overrides: Partial<SampleDetail> = {}): SampleDetail => ({
  ...sampleSummary(),
  text: sampleText,
  topWords: [
    { word: 'the', count: 1 },
    { word: 'race', count: 1 },
  ],
  unknownWords: [{ word: 'Pepper', count: 1 }],
  flags: [
    {
      id: 'f1a2b3c4-d5e6-4f7a-8b9c-0d1e2f3a4b01',
      kind: 'phone',
      start: sampleText.indexOf('07700'),
      end: sampleText.indexOf('07700') + '07700 900123'.length,
      text: '07700 900123',
      status: 'open',
      reason: null,
      decidedBy: null,
      decidedAt: null,
    },
    {
      id: 'f1a2b3c4-d5e6-4f7a-8b9c-0d1e2f3a4b02',
      kind: 'email',
      start: sampleText.indexOf('rob@'),
      end: sampleText.indexOf('rob@') + 'rob@harbour.example'.length,
      text: 'rob@harbour.example',
      status: 'open',
      reason: null,
      decidedBy: null,
      decidedAt: null,
    },
  ],
  ...overrides,
});

export const auditEvent = (overrides: Partial<AuditEventView> = {}): AuditEventView => ({
  id: '101',
  at: '2026-09-15T08:00:00.000Z',
  actorId: demoStaff.clinician.id,
  actorEmail: 'clinician@willowmere.example',
  actorName: 'Dr. Tomasz Reyes',
  action: 'sample.upload',
  subjectType: 'sample',
  subjectId: SAMPLE_ID,
  clientId: ASHBY_ID,
  clientPseudonym: 'R. Ashby',
  details: { fileName: 'sailing-club.txt', bytes: 96 },
  ip: '127.0.0.1',
  sentence: 'Dr. Tomasz Reyes: Uploaded a language sample (R. Ashby)',
  ...overrides,
});
