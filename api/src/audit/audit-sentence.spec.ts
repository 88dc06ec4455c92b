// The sentences are Keyloom's own wording: common practice, no source.
import { auditActionLabels } from '@keyloom/shared';
import { auditSentence, type SentenceInput } from './audit-sentence';

const IMOGEN = '11111111-1111-4111-8111-111111111111';
const SAM = '22222222-2222-4222-8222-222222222222';

const event = (overrides: Partial<SentenceInput>): SentenceInput => ({
  action: 'auth.sign-in',
  actorName: 'Imogen Hale',
  actorEmail: 'imogen@willowmere.example',
  subjectType: null,
  subjectId: null,
  clientPseudonym: null,
  details: {},
  userNames: new Map([
    [IMOGEN, 'Imogen Hale'],
    [SAM, 'Sam Okafor'],
  ]),
  ...overrides,
});

describe(auditSentence.name, () => {
  it('says whose role changed, from what to what, by name', () => {
    const sentence = auditSentence(
      event({
        action: 'user.update',
        subjectType: 'user',
        subjectId: SAM,
        details: { changes: { role: { from: 'carer', to: 'clinician' } } },
      }),
    );
    expect(sentence).toBe('Imogen Hale changed Sam Okafor’s role from carer to clinician');
  });

  it('lists several account changes, never a password', () => {
    const sentence = auditSentence(
      event({
        action: 'user.update',
        subjectId: SAM,
        details: {
          changes: {
            name: { from: 'Sam Okafo', to: 'Sam Okafor' },
            active: { from: true, to: false },
            password: { from: 'previous', to: 'new' },
          },
        },
      }),
    );
    expect(sentence).toBe(
      'Imogen Hale changed Sam Okafor’s name from Sam Okafo to Sam Okafor, account from active to inactive and password',
    );
    expect(sentence).not.toContain('previous');
  });

  it('names the fields of a client record that changed', () => {
    const sentence = auditSentence(
      event({
        action: 'client.update',
        clientPseudonym: 'R. Ashby',
        details: { fields: ['accessMethod', 'notes'] },
      }),
    );
    expect(sentence).toBe('Imogen Hale changed R. Ashby’s record: access method and notes');
  });

  it('says a consent record was voided, without its reason', () => {
    const sentence = auditSentence(
      event({ action: 'consent.void', clientPseudonym: 'R. Ashby', details: { reasonSha256: 'ab12' } }),
    );
    expect(sentence).toBe('Imogen Hale voided a consent record of R. Ashby made in error');
  });

  it('tells a profile approval that retired the previous version from one that did not', () => {
    const approve = (retired: string | null) =>
      auditSentence(
        event({
          action: 'profile.approve',
          clientPseudonym: 'R. Ashby',
          details: { status: 'active', retired },
        }),
      );
    expect(approve(null)).toBe('Imogen Hale approved a profile version of R. Ashby');
    expect(approve(SAM)).toBe('Imogen Hale approved a profile version of R. Ashby, retiring the one before');
  });

  it('names the versions approved, retired, signed off and sent back where the event stored their numbers', () => {
    const say = (action: string, details: Record<string, unknown>) =>
      auditSentence(event({ action, clientPseudonym: 'R. Ashby', details }));
    expect(say('profile.approve', { status: 'active', number: 3, retired: SAM, retiredNumber: 2 })).toBe(
      'Imogen Hale approved version 3 of R. Ashby’s profile, retiring version 2',
    );
    expect(say('profile.approve', { status: 'active', number: 1, retired: null, retiredNumber: null })).toBe(
      'Imogen Hale approved version 1 of R. Ashby’s profile',
    );
    expect(say('profile.sign-off', { status: 'signed_off', number: 3 })).toBe(
      'Imogen Hale signed off version 3 of R. Ashby’s profile after a trial',
    );
    expect(say('profile.send-back', { status: 'sent_back', number: 3 })).toBe(
      'Imogen Hale sent version 3 of R. Ashby’s profile back for changes',
    );
  });

  it('gives the number of a retired version', () => {
    const sentence = auditSentence(
      event({ action: 'profile.retire', clientPseudonym: 'R. Ashby', details: { number: 3 } }),
    );
    expect(sentence).toBe('Imogen Hale retired version 3 of R. Ashby’s profile');
  });

  it('says which report was downloaded', () => {
    const say = (action: string, details: Record<string, unknown>) =>
      auditSentence(event({ action, clientPseudonym: 'R. Ashby', details }));
    expect(say('report.version-pdf', { number: 2, paper: 'a4', bytes: 1000 })).toBe(
      'Imogen Hale downloaded the PDF report of version 2 of R. Ashby’s profile',
    );
    expect(say('report.client-pdf', { from: '2026-09-01', to: '2026-11-30', paper: 'a4' })).toBe(
      'Imogen Hale downloaded the PDF report of R. Ashby for 1 Sept 2026 to 30 Nov 2026',
    );
  });

  it('counts the family contacts a summary went to', () => {
    const send = (recipients: number) =>
      auditSentence(event({ action: 'summary.send', clientPseudonym: 'R. Ashby', details: { recipients } }));
    expect(send(2)).toBe('Imogen Hale sent a progress summary about R. Ashby to 2 family contacts');
    expect(send(1)).toBe('Imogen Hale sent a progress summary about R. Ashby to 1 family contact');
  });

  it('names the carer of an assignment from the id in the details', () => {
    const sentence = auditSentence(
      event({ action: 'assignment.create', clientPseudonym: 'R. Ashby', details: { carerId: SAM } }),
    );
    expect(sentence).toBe('Imogen Hale assigned Sam Okafor as carer of R. Ashby');
    expect(sentence).not.toContain(SAM);
  });

  it('falls back to the action’s label, the typed e-mail and Keyloom itself', () => {
    expect(auditSentence(event({ action: 'sample.upload', clientPseudonym: 'R. Ashby' }))).toBe(
      `Imogen Hale: ${auditActionLabels['sample.upload']} (R. Ashby)`,
    );
    expect(
      auditSentence(event({ action: 'auth.sign-in-failed', actorName: null, actorEmail: 'x@y.example' })),
    ).toBe(`x@y.example: ${auditActionLabels['auth.sign-in-failed']}`);
    expect(auditSentence(event({ action: 'profile.trained', actorName: null, actorEmail: null }))).toBe(
      `Keyloom: ${auditActionLabels['profile.trained']}`,
    );
  });
});
