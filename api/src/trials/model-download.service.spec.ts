import { createHash } from 'node:crypto';
import { gunzipSync } from 'node:zlib';
import { etagMatches, gzipDeterministic, sha256Hex } from './model-download.service';

describe('gzipDeterministic', () => {
  it('gives the same bytes every time, which node:zlib gunzips back', async () => {
    const input = new TextEncoder().encode(
      'the tide turned and the wind came round to the west '.repeat(200),
    );
    const a = await gzipDeterministic(input);
    const b = await gzipDeterministic(input);
    expect(a.gzip.equals(b.gzip)).toBe(true);
    expect(a.etag).toBe(`"${createHash('sha256').update(a.gzip).digest('hex')}"`);
    expect(a.uncompressedBytes).toBe(input.length);
    expect(gunzipSync(a.gzip).equals(Buffer.from(input))).toBe(true);
    // RFC 1952: magic 1f 8b, method 8 (deflate), no flags, MTIME 0 (bytes 4–7), XFL 2 = maximum compression.
    expect([...a.gzip.subarray(0, 9)]).toEqual([0x1f, 0x8b, 8, 0, 0, 0, 0, 0, 2]);
    expect(a.gzip.length).toBeLessThan(input.length / 10);
  });

  it('sha256Hex matches a published test vector', () => {
    // FIPS 180-2 appendix B.1: SHA-256("abc").
    expect(sha256Hex(new TextEncoder().encode('abc'))).toBe(
      'ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad',
    );
  });
});

describe('etagMatches', () => {
  const etag = '"3f2a"';
  it('matches the tag, a weak form of it, a list holding it, or *', () => {
    expect(etagMatches('"3f2a"', etag)).toBe(true);
    expect(etagMatches('W/"3f2a"', etag)).toBe(true);
    expect(etagMatches('"aaaa", "3f2a"', etag)).toBe(true);
    expect(etagMatches('*', etag)).toBe(true);
  });
  it('does not match another tag, an unquoted one or no header', () => {
    expect(etagMatches('"3f2b"', etag)).toBe(false);
    expect(etagMatches('3f2a', etag)).toBe(false);
    expect(etagMatches(undefined, etag)).toBe(false);
    expect(etagMatches('', etag)).toBe(false);
  });
});
