// Serialised models load back with identical predictions, and two trainings
// of the same text serialise to identical bytes (determinism).
import { describe, expect, it } from 'vitest';
import { PpmModel } from './ppm-model';
import { deserializeModel, serializeModel } from './model-serialization';
import { Distribution } from './model-types';
import { codePointsOf } from './text-preparation';
import { seededRandom } from './seeded-random';
import { crc32 } from './crc32';

const random = seededRandom(4);
const words = [
  'the',
  'dog',
  'Biscuit',
  'walk',
  'park',
  'Nan',
  'tea',
  'garden',
  'today',
  'we',
  'went',
  'to',
  'é',
  '🐕',
];
let s = '';
while (s.length < 20000) s += words[Math.floor(random() * words.length)] + (random() < 0.1 ? '.\n' : ' ');
const text = codePointsOf(s);

describe('serializeModel / deserializeModel', () => {
  for (const settings of [
    { order: 5 },
    { order: 2, escape: 'D' as const, exclusion: false },
    { order: 8, escape: 'B' as const, updateExclusion: false, adaptive: false },
  ]) {
    it(`gives identical probabilities at every position (${JSON.stringify(settings)})`, () => {
      const model = PpmModel.train(text.subarray(0, 15000), settings).freeze();
      const loaded = deserializeModel(serializeModel(model));
      expect({ ...loaded.settings, adaptive: true }).toEqual({ ...model.settings, adaptive: true });
      expect(loaded.adaptive).toBe(false); // frozen models load frozen
      expect(loaded.contextCount).toBeLessThanOrEqual(model.contextCount);
      const a = new Distribution();
      const b = new Distribution();
      for (let i = 15000; i < text.length; i++) {
        expect(loaded.probability(text, i, text[i])).toBe(model.probability(text, i, text[i]));
        if (i % 50 === 0) {
          model.distribution(text, i, a);
          loaded.distribution(text, i, b);
          expect(Array.from(b.symbols.subarray(0, b.size))).toEqual(
            Array.from(a.symbols.subarray(0, a.size)),
          );
          expect(Array.from(b.probs.subarray(0, b.size))).toEqual(Array.from(a.probs.subarray(0, a.size)));
        }
      }
    });
  }

  it('keeps learning identically after loading when adaptive', () => {
    const model = PpmModel.train(text.subarray(0, 10000), { order: 4 });
    const loaded = deserializeModel(serializeModel(model));
    for (let i = 10000; i < 12000; i++) {
      expect(loaded.probability(text, i, text[i])).toBe(model.probability(text, i, text[i]));
      model.learn(text, i);
      loaded.learn(text, i);
    }
    expect(serializeModel(loaded)).toEqual(serializeModel(model));
  });

  it('gives identical bytes for two trainings of the same text', () => {
    const one = serializeModel(PpmModel.train(text, { order: 6 }));
    const two = serializeModel(PpmModel.train(text, { order: 6 }));
    expect(two).toEqual(one);
    expect(crc32(one)).toBe(crc32(two));
  });

  it('rejects damaged, truncated and foreign bytes', () => {
    const bytes = serializeModel(PpmModel.train(text.subarray(0, 3000), { order: 3 }));
    const bad = bytes.slice();
    bad[bytes.length >> 1] ^= 1;
    expect(() => deserializeModel(bad)).toThrow(/checksum/);
    expect(() => deserializeModel(bytes.subarray(0, bytes.length - 3))).toThrow(/checksum|truncated/);
    const wrong = bytes.slice();
    wrong[0] = 0;
    expect(() => deserializeModel(wrong)).toThrow(/magic/);
    const version = bytes.slice();
    version[4] = 9;
    expect(() => deserializeModel(version)).toThrow(/version/);
  });

  it('refuses declared counts the bytes cannot hold before allocating for them (checksum recomputed)', () => {
    const bytes = serializeModel(PpmModel.train(text.subarray(0, 3000), { order: 3 }));
    const trieBytes = bytes.length - 28;
    const forged = (offset: number, value: number) => {
      const copy = bytes.slice();
      const view = new DataView(copy.buffer);
      view.setUint32(offset, value, true);
      view.setUint32(copy.length - 4, crc32(copy, 0, 0, copy.length - 4), true);
      return copy;
    };
    const before = process.memoryUsage().arrayBuffers;
    expect(() => deserializeModel(forged(16, 400_000_000))).toThrow(
      `damaged: declares 400000000 contexts but holds only ${trieBytes} bytes`,
    );
    expect(() => deserializeModel(forged(20, 0xffffffff))).toThrow(
      `damaged: declares 4294967295 entries but holds only ${trieBytes} bytes`,
    );
    // Either count alone fits, both together do not.
    expect(() => deserializeModel(forged(16, trieBytes - 2))).toThrow(
      /damaged: declares .* bytes of contexts and entries/,
    );
    // Nothing of the declared size was allocated (400 million contexts would take gigabytes).
    expect(process.memoryUsage().arrayBuffers - before).toBeLessThan(16 * 1024 * 1024);
  });
});

describe('large models', () => {
  it('spans several storage segments (over 2^20 entries and 2^16 contexts) with identical predictions after save, load and clone', () => {
    const rnd = seededRandom(12);
    const big = new Uint32Array(260000).map(() => 0x21 + Math.floor(rnd() * 60));
    const model = PpmModel.train(big, { order: 6 });
    expect(model.entryCount).toBeGreaterThan(1 << 20);
    expect(model.contextCount).toBeGreaterThan(1 << 16);
    const loaded = deserializeModel(serializeModel(model));
    const copy = model.clone();
    const probe = big.subarray(250000, 260000);
    for (let i = 0; i < probe.length; i += 7) {
      const p = model.probability(probe, i, probe[i]);
      expect(loaded.probability(probe, i, probe[i])).toBe(p);
      expect(copy.probability(probe, i, probe[i])).toBe(p);
    }
    expect(serializeModel(copy)).toEqual(serializeModel(model));
  });
});
