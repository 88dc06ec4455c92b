// The word list and the base vocabulary file: what they keep, round trips, and damage refused.
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { baseWordsFile, loadBaseWords } from '../../base-words';
import { ByteWriter, FormatError } from '@keyloom/shared/src/engine/byte-io';
import { crc32 } from '@keyloom/shared/src/engine/crc32';
import { prepareText } from '@keyloom/shared/src/engine/text-preparation';
import { deserializeBaseWords, serializeBaseWords } from '@keyloom/shared/src/engine/words/base-words-file';
import { WordLexicon } from '@keyloom/shared/src/engine/words/word-lexicon';
import { trainWordModel } from '@keyloom/shared/src/engine/words/word-training';
import type { BaseWords } from '@keyloom/shared/src/engine/words/word-predictor';

// Invented frequencies (not from any list).
const ENTRIES: [string, number][] = [
  ['the', 500],
  ['The', 20],
  ['harbour', 30],
  ['Bertram', 12],
  ['bertram', 3],
  ['don’t', 40],
  ["don't", 10],
  ['x-ray', 4],
  ['naïve', 2],
  ['skipped', 0],
  ['', 9],
];

describe('WordLexicon', () => {
  const lex = WordLexicon.fromEntries(ENTRIES);

  it('adds forms with the same key, keeps the commonest form, and drops empty or zero rows', () => {
    expect(lex.size).toBe(6);
    expect(lex.total).toBe(500 + 20 + 30 + 12 + 3 + 40 + 10 + 4 + 2);
    expect(lex.probability('the')).toBeCloseTo(520 / lex.total, 15);
    expect(lex.form(lex.idOf('bertram'))).toBe('Bertram');
    expect(lex.probability("don't")).toBeCloseTo(50 / lex.total, 15);
    expect(lex.form(lex.idOf("don't"))).toBe('don’t');
    expect(lex.idOf('skipped')).toBe(-1);
    expect(lex.probability('skipped')).toBe(0);
    expect(lex.keys[0]).toBe('the'); // by descending frequency
  });

  it('round-trips keys, forms and probabilities', () => {
    const back = WordLexicon.fromBytes(lex.toBytes());
    expect(back.keys).toEqual(lex.keys);
    expect(back.total).toBe(lex.total);
    for (let id = 0; id < lex.size; id++) {
      expect(back.form(id)).toBe(lex.form(id));
      expect(back.probability(lex.keys[id])).toBe(lex.probability(lex.keys[id]));
    }
  });

  it('refuses every single flipped byte and every truncation with a FormatError', () => {
    const bytes = lex.toBytes();
    for (let i = 0; i < bytes.length; i++) {
      const damaged = bytes.slice();
      damaged[i] ^= 0x80 >> (i % 8);
      expect(() => WordLexicon.fromBytes(damaged), `byte ${i}`).toThrow(FormatError);
    }
    for (let n = 0; n < bytes.length; n++)
      expect(() => WordLexicon.fromBytes(bytes.subarray(0, n)), `first ${n} bytes`).toThrow(FormatError);
  });

  it('refuses a forged word count with a good CRC before allocating for it', () => {
    const w = new ByteWriter();
    for (const b of [0x8b, 0x4b, 0x4c, 0x4c, 1]) w.u8(b);
    w.varint(2 ** 35); // "34 billion words" in a 20-byte file
    for (let i = 0; i < 6; i++) w.u8(0);
    w.u32(crc32(w.result()));
    expect(() => WordLexicon.fromBytes(w.result())).toThrow(/declares 34359738368 words/);
  });
});

describe('base vocabulary file', () => {
  // Invented text (no corpus).
  const texts = [
    'We sail at dawn. The harbour is calm. We sail to the island and back. The harbour master waves.',
    'Bertram rows the boat. Bertram says the harbour is calm at dawn. We row back to the harbour.',
  ].map((t) => prepareText(t));
  const small: BaseWords = {
    ngram: trainWordModel(texts).pruned(2),
    lexicon: WordLexicon.fromEntries(ENTRIES),
  };

  it('round-trips the word model and the word list (same probabilities)', () => {
    const back = deserializeBaseWords(serializeBaseWords(small));
    expect(back.ngram.adaptive).toBe(false);
    expect(back.ngram.keys).toEqual(small.ngram.keys);
    expect(back.lexicon?.keys).toEqual(small.lexicon?.keys);
    for (const [u, v, w] of [
      ['<s>', '<s>', 'we'],
      ['the', 'harbour', 'is'],
      ['we', 'sail', 'to'],
      ['bertram', 'rows', 'the'],
    ])
      expect(back.ngram.probability(u, v, w), `${u} ${v} ${w}`).toBeCloseTo(
        small.ngram.probability(u, v, w),
        6,
      );
    const withoutList = deserializeBaseWords(serializeBaseWords({ ngram: small.ngram, lexicon: null }));
    expect(withoutList.lexicon).toBeNull();
  });

  it('refuses every single flipped byte and every truncation with a FormatError', () => {
    const bytes = serializeBaseWords(small);
    for (let i = 0; i < bytes.length; i++) {
      const damaged = bytes.slice();
      damaged[i] ^= 0x01 << ((i * 3) % 8);
      expect(() => deserializeBaseWords(damaged), `byte ${i}`).toThrow(FormatError);
    }
    for (let n = 0; n < bytes.length; n++)
      expect(() => deserializeBaseWords(bytes.subarray(0, n)), `first ${n} bytes`).toThrow(FormatError);
  });

  it('refuses a part whose declared length runs past the end, with a good CRC', () => {
    const w = new ByteWriter();
    for (const b of [0x8b, 0x4b, 0x4c, 0x42, 1]) w.u8(b);
    w.u32(0xfffffff0);
    for (let i = 0; i < 12; i++) w.u8(0);
    w.u32(crc32(w.result()));
    expect(() => deserializeBaseWords(w.result())).toThrow(/a part runs past the end/);
  });

  it('the cached base vocabulary (Brown corpus and SUBTLEX-US) writes back byte for byte', () => {
    const file = new Uint8Array(readFileSync(baseWordsFile()));
    const written = serializeBaseWords(loadBaseWords());
    expect(written.length).toBe(file.length);
    expect(Buffer.compare(Buffer.from(written), Buffer.from(file))).toBe(0);
  });
});
