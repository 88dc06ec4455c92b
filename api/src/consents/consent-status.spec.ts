import {
  clientConsentStatus,
  consentRecordStatus,
  type ConsentTerms,
  coversScope,
  isInForce,
  releasedScopes,
  todayIso,
} from './consent-status';

const TODAY = '2026-12-01';
const record = (overrides: Partial<ConsentTerms> = {}): ConsentTerms => ({
  scopes: ['training', 'summaries'],
  givenOn: '2026-09-14',
  expiresOn: null,
  withdrawnAt: null,
  ...overrides,
});

describe('consent status', () => {
  it.each<[string, Partial<ConsentTerms>, 'active' | 'expired' | 'withdrawn', boolean]>([
    ['no expiry', {}, 'active', true],
    ['expires today (the last day counts)', { expiresOn: TODAY }, 'active', true],
    ['expired yesterday', { expiresOn: '2026-11-30' }, 'expired', false],
    ['given today', { givenOn: TODAY }, 'active', true],
    ['given tomorrow (not yet in force)', { givenOn: '2026-12-02' }, 'active', false],
    ['withdrawn', { withdrawnAt: new Date('2026-10-01T10:00:00Z') }, 'withdrawn', false],
    [
      'withdrawn and expired: withdrawn wins',
      { withdrawnAt: '2026-10-01', expiresOn: '2026-11-01' },
      'withdrawn',
      false,
    ],
  ])('%s', (_label, overrides, status, inForce) => {
    expect(consentRecordStatus(record(overrides), TODAY)).toBe(status);
    expect(isInForce(record(overrides), TODAY)).toBe(inForce);
  });

  it('a voided record (made in error) is not consent: not in force, and left out of the client status', () => {
    const voided = record({ voidedAt: '2026-10-02T09:00:00Z' });
    expect(consentRecordStatus(voided, TODAY)).toBe('voided');
    expect(isInForce(voided, TODAY)).toBe(false);
    expect(coversScope([voided], 'training', TODAY)).toBe(false);
    // Newest first: a voided newest record gives way to the one before it.
    expect(clientConsentStatus([voided, record({ withdrawnAt: '2026-10-01' })], TODAY)).toBe('withdrawn');
    expect(clientConsentStatus([voided], TODAY)).toBe('none');
    expect(releasedScopes(record({ scopes: ['training'] }), [voided], TODAY)).toEqual(['training']);
  });

  it('checks the scope: a summaries-only consent does not allow training', () => {
    const summariesOnly = [record({ scopes: ['summaries'] })];
    expect(coversScope(summariesOnly, 'training', TODAY)).toBe(false);
    expect(coversScope(summariesOnly, 'summaries', TODAY)).toBe(true);
  });

  it('sums up a client: any record in force makes it active, else the newest record decides', () => {
    expect(clientConsentStatus([], TODAY)).toBe('none');
    const withdrawn = record({ withdrawnAt: '2026-10-01' });
    const expired = record({ expiresOn: '2026-11-01' });
    expect(clientConsentStatus([withdrawn, expired], TODAY)).toBe('withdrawn');
    expect(clientConsentStatus([expired, withdrawn], TODAY)).toBe('expired');
    expect(clientConsentStatus([withdrawn, record()], TODAY)).toBe('active');
    expect(clientConsentStatus([record({ givenOn: '2027-01-01' })], TODAY)).toBe('none');
  });

  it('releases only the scopes of the withdrawn record that no other record in force covers', () => {
    const training = record({ scopes: ['training'] });
    const summaries = record({ scopes: ['summaries'] });
    const both = record();
    expect(releasedScopes(summaries, [training], TODAY)).toEqual(['summaries']);
    expect(releasedScopes(training, [summaries], TODAY)).toEqual(['training']);
    expect(
      releasedScopes(training, [record({ scopes: ['training'], givenOn: '2026-01-02' })], TODAY),
    ).toEqual([]);
    expect(releasedScopes(both, [training], TODAY)).toEqual(['summaries']);
    expect(releasedScopes(both, [], TODAY)).toEqual(['training', 'summaries']);
    // A record that is not in force keeps nothing: withdrawn, expired, or given only in the future.
    for (const other of [
      record({ scopes: ['training'], withdrawnAt: '2026-10-01' }),
      record({ scopes: ['training'], expiresOn: '2026-11-30' }),
      record({ scopes: ['training'], givenOn: '2026-12-02' }),
    ]) {
      expect(releasedScopes(training, [other], TODAY)).toEqual(['training']);
    }
  });

  it('gives the local calendar date as YYYY-MM-DD', () => {
    expect(todayIso(new Date(2026, 0, 5, 23, 59))).toBe('2026-01-05');
    expect(todayIso(new Date(2026, 11, 31, 0, 0))).toBe('2026-12-31');
  });
});
