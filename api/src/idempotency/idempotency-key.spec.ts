import { parseIdempotencyKey } from './idempotency-key';
import { requestFingerprint } from './idempotency.service';

describe('parseIdempotencyKey', () => {
  it('reads the structured-field string of the draft’s examples (RFC 8941 §3.3.3)', () => {
    expect(parseIdempotencyKey('"8e03978e-40d5-43e8-bc93-6894a57f9324"')).toBe(
      '8e03978e-40d5-43e8-bc93-6894a57f9324',
    );
    // Backslash escapes only a quote or a backslash.
    expect(parseIdempotencyKey('"a\\"b\\\\c"')).toBe('a"b\\c');
    expect(parseIdempotencyKey('"a\\nb"')).toBeNull();
  });

  it('takes a bare token, and tells a missing header from a malformed one', () => {
    expect(parseIdempotencyKey('abc-123')).toBe('abc-123');
    expect(parseIdempotencyKey(undefined)).toBeUndefined();
    for (const bad of ['', '""', '"open', 'two words', '"in"side"', `"${'k'.repeat(256)}"`, '"tab\there"']) {
      expect(parseIdempotencyKey(bad)).toBeNull();
    }
    expect(parseIdempotencyKey(`"${'k'.repeat(255)}"`)).toHaveLength(255);
    expect(parseIdempotencyKey(['"a"', '"b"'])).toBeNull();
  });
});

describe('requestFingerprint', () => {
  it('differs when the route or the body differs, and not otherwise', () => {
    const a = requestFingerprint({ route: 'POST /x', body: { note: 'a' } });
    expect(a).toMatch(/^[0-9a-f]{64}$/);
    expect(requestFingerprint({ route: 'POST /x', body: { note: 'a' } })).toBe(a);
    expect(requestFingerprint({ route: 'POST /x', body: { note: 'b' } })).not.toBe(a);
    expect(requestFingerprint({ route: 'POST /y', body: { note: 'a' } })).not.toBe(a);
  });
});
