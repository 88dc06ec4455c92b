// The compressed-file container, CRC-32 and the strict UTF-8 codec, checked
// against node:zlib and node's TextDecoder/TextEncoder (general-purpose
// reference libraries).
import * as zlib from 'node:zlib';
import { describe, expect, it } from 'vitest';
import { crc32 } from './crc32';
import { compressBytes, decompressBytes } from './container';
import { decodeUtf8, encodeUtf8 } from './utf8-codec';
import { seededRandom } from './seeded-random';

const utf8 = (s: string): Uint8Array => new TextEncoder().encode(s);
const sampleText = '\uFEFFDear Mo,\r\nthe dog walk was fun.\rLone CR kept.\n👋🏽 Grüße — fin.\n'.repeat(20);
const sample = utf8(sampleText);

describe('crc32', () => {
  it('equals node:zlib crc32 (general-purpose reference library)', () => {
    const random = seededRandom(1);
    for (const n of [0, 1, 3, 255, 1000, 65537]) {
      const bytes = new Uint8Array(n).map(() => Math.floor(random() * 256));
      expect(crc32(bytes)).toBe(zlib.crc32(bytes));
      // continuing over two halves equals one pass (zlib's running-value convention)
      const half = n >> 1;
      expect(crc32(bytes.subarray(half), crc32(bytes.subarray(0, half)))).toBe(zlib.crc32(bytes));
    }
    // The check value of CRC-32/ISO-HDLC for "123456789" is 0xCBF43926 (from memory; zlib agrees above).
    expect(crc32(utf8('123456789'))).toBe(0xcbf43926);
  });
});

describe('utf8 codec', () => {
  it('agrees with a fatal TextDecoder on random and edge-case byte strings (node, reference)', () => {
    const decoder = new TextDecoder('utf-8', { fatal: true, ignoreBOM: true });
    const random = seededRandom(2);
    const cases: Uint8Array[] = [
      new Uint8Array([0xef, 0xbb, 0xbf, 0x41]), // BOM kept
      new Uint8Array([0xc0, 0x80]), // overlong
      new Uint8Array([0xed, 0xa0, 0x80]), // surrogate
      new Uint8Array([0xf4, 0x90, 0x80, 0x80]), // > U+10FFFF
      new Uint8Array([0xe2, 0x82]), // cut off
      new Uint8Array([0xf0, 0x9f, 0x98, 0x80]),
    ];
    for (let k = 0; k < 3000; k++) {
      const n = Math.floor(random() * 8);
      cases.push(
        new Uint8Array(n).map(() =>
          random() < 0.5 ? 0x80 + Math.floor(random() * 0x78) : Math.floor(random() * 256),
        ),
      );
    }
    for (const bytes of cases) {
      let expected: string | undefined;
      try {
        expected = decoder.decode(bytes);
      } catch {
        expected = undefined;
      }
      const got = decodeUtf8(bytes);
      if (expected === undefined) expect(got).toBeUndefined();
      else {
        expect(got && String.fromCodePoint(...got)).toBe(expected);
        expect(encodeUtf8(got!)).toEqual(bytes);
      }
    }
  });
});

describe('container', () => {
  it('restores the input byte for byte, BOM and lone CR included', () => {
    const packed = compressBytes(sample, { order: 5, escape: 'C' });
    expect(packed.length).toBeLessThan(sample.length / 3);
    expect(decompressBytes(packed)).toEqual(sample);
    for (const escape of ['A', 'B', 'D'] as const)
      expect(decompressBytes(compressBytes(sample, { order: 2, escape }))).toEqual(sample);
    expect(decompressBytes(compressBytes(new Uint8Array(0), { order: 5, escape: 'C' }))).toEqual(
      new Uint8Array(0),
    );
  });

  it('refuses bytes that are not UTF-8', () => {
    expect(() => compressBytes(new Uint8Array([0x41, 0xff, 0x42]), { order: 5, escape: 'C' })).toThrow(
      /not valid UTF-8/,
    );
  });

  it('rejects every single damaged byte', () => {
    const packed = compressBytes(utf8(sampleText.slice(0, 150)), { order: 3, escape: 'C' });
    for (let i = 0; i < packed.length; i++) {
      const bad = packed.slice();
      bad[i] ^= 0x10;
      expect(() => decompressBytes(bad), `byte ${i}`).toThrow(/damaged|magic|version|truncated/);
    }
  });

  it('refuses a declared length its payload cannot hold without allocating it (header checksum recomputed)', () => {
    const packed = compressBytes(utf8('a short note'), { order: 3, escape: 'C' });
    const forged = packed.slice();
    const view = new DataView(forged.buffer);
    // 2^31 code points of 1 byte each: an 8 GB array if the length were trusted.
    view.setUint32(12, 2 ** 31, true);
    view.setUint32(16, 2 ** 31, true);
    view.setUint32(28, crc32(forged, 0, 0, 28), true);
    const before = process.memoryUsage().arrayBuffers;
    expect(() => decompressBytes(forged)).toThrow(
      /^damaged: declares 2147483648 code points but holds only \d+ bytes$/,
    );
    expect(process.memoryUsage().arrayBuffers - before).toBeLessThan(64 * 1024 * 1024);
  });

  it('still restores text that compresses extremely well (many code points per payload byte)', () => {
    const input = utf8('a'.repeat(300_000));
    const packed = compressBytes(input, { order: 2, escape: 'D' });
    expect(input.length / packed.length).toBeGreaterThan(100);
    expect(decompressBytes(packed)).toEqual(input);
  });

  it('rejects a truncated file and a wrong magic', () => {
    const packed = compressBytes(sample, { order: 5, escape: 'C' });
    expect(() => decompressBytes(packed.subarray(0, packed.length - 1))).toThrow(/truncated/);
    expect(() => decompressBytes(packed.subarray(0, 10))).toThrow(/truncated/);
    const wrong = packed.slice();
    wrong[1] = 0x50;
    expect(() => decompressBytes(wrong)).toThrow(/magic/);
    expect(() => decompressBytes(utf8('plain text, not ours'))).toThrow(/magic/);
  });
});
