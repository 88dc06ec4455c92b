import { createHmac } from 'node:crypto';
import { crc32 as zlibCrc32 } from 'node:zlib';
import { describe, expect, it } from 'vitest';
import { PpmModel } from '../ppm-model';
import { serializeModel } from '../model-serialization';
import { prepareText } from '../text-preparation';
import { WordNgramModel } from '../words/word-ngram-model';
import { trainWordModel } from '../words/word-training';
import {
  PROFILE_FILE_SIGNED_WORDS_VERSION,
  PROFILE_FILE_WORDS_VERSION,
  type ProfileFileHeader,
  ProfileFileError,
  readProfileFile,
  verifyProfileFile,
  writeProfileFile,
} from './profile-file';

// Invented for the demo scenario (not from any corpus).
const text =
  'Pepper and I went down to the harbour before the regatta. The wind was steady from the south west. ' +
  'My sister brought coffee and we talked about the jazz standards for Thursday — café au lait, naïve.';

function header(): ProfileFileHeader {
  return {
    format: 'keyloom-profile',
    client: { pseudonym: 'R. Ashby' },
    version: { id: '00000000-0000-4000-8000-000000000001', number: 2, status: 'active', note: 'Ünïcode ✓' },
    settings: { order: 5, escape: 'C', exclusion: true, baseWeight: 'auto', slots: 5 },
    baseWeight: 0.42,
    baseModelSha256: 'ab'.repeat(32),
    engineVersion: 'test',
    metrics: { bpcIdeal: 2.1 },
    samples: [{ title: 'Diary', sha256: 'cd'.repeat(32), characters: text.length }],
    createdAt: '2026-12-01T10:00:00.000Z',
    trainedAt: '2026-12-01T10:01:00.000Z',
    approvedBy: 'Supervisor',
    approvedAt: '2026-12-01T11:00:00.000Z',
    exportedAt: '2026-12-01T12:00:00.000Z',
    exportedBy: 'Clinician',
  };
}

function model(): Uint8Array {
  return serializeModel(PpmModel.train(prepareText(text), { order: 3 }));
}

describe('profile file (.klprofile)', () => {
  it('round-trips header and model bytes', () => {
    const bytes = writeProfileFile(header(), model());
    const read = verifyProfileFile(bytes);
    expect(read.header).toEqual(header());
    expect([...read.model]).toEqual([...model()]);
    expect(read.modelOrder).toBe(3);
    expect(read.modelContexts).toBeGreaterThan(10);
  });

  it('writes the base-model weight as baseWeight and still reads a file whose header says blendWeight', () => {
    const bytes = writeProfileFile(header(), model());
    const headerText = new TextDecoder().decode(
      bytes.subarray(10, 10 + new DataView(bytes.buffer).getUint32(6, true)),
    );
    expect(JSON.parse(headerText)).toMatchObject({ baseWeight: 0.42 });
    expect(headerText).not.toContain('blendWeight');
    // A file exported before the rename: the same header under the old key.
    const { baseWeight, ...rest } = header();
    const old = writeProfileFile(
      { ...rest, blendWeight: baseWeight } as unknown as ProfileFileHeader,
      model(),
    );
    const read = verifyProfileFile(old);
    expect(read.header.baseWeight).toBe(0.42);
    expect(read.header).toEqual(header());
  });

  it('ends with the CRC-32 of everything before it, as node:zlib computes it (general-purpose reference)', () => {
    const bytes = writeProfileFile(header(), model());
    const stored = new DataView(bytes.buffer).getUint32(bytes.length - 4, true);
    expect(stored).toBe(zlibCrc32(Buffer.from(bytes.subarray(0, bytes.length - 4))));
    expect(String.fromCharCode(...bytes.subarray(0, 4))).toBe('KLPF');
  });

  it('refuses a file with any single byte changed', () => {
    const bytes = writeProfileFile(header(), model());
    // Every 7th position, so header, lengths, model and checksum are all hit.
    for (let i = 0; i < bytes.length; i += 7) {
      const damaged = bytes.slice();
      damaged[i] ^= 0x20;
      expect(() => verifyProfileFile(damaged), `byte ${i}`).toThrow(ProfileFileError);
    }
  });

  it('says what is wrong: not a profile, cut short, checksum', () => {
    const bytes = writeProfileFile(header(), model());
    expect(() => readProfileFile(new Uint8Array([0x50, 0x4b, 3, 4, 0, 0]))).toThrow(/not a Keyloom profile/);
    expect(() => readProfileFile(bytes.subarray(0, bytes.length - 10))).toThrow(/cut short/);
    const damaged = bytes.slice();
    damaged[bytes.length - 30] ^= 1;
    expect(() => readProfileFile(damaged)).toThrow(/checksum does not match/);
  });

  describe('signed layout (version 2)', () => {
    // HMAC-SHA-256 (RFC 2104) from node:crypto, as the API signs; the key is invented for the test.
    const key = Buffer.from('a test key that is not any installation’s key', 'utf8');
    const sign = (bytes: Uint8Array) => new Uint8Array(createHmac('sha256', key).update(bytes).digest());

    it('carries the signer’s 32 bytes over every byte before them, then the CRC-32 of all before it', () => {
      const bytes = writeProfileFile(header(), model(), sign);
      const view = new DataView(bytes.buffer);
      expect(view.getUint16(4, true)).toBe(2);
      const signatureAt = bytes.length - 4 - 32;
      expect([...bytes.subarray(signatureAt, bytes.length - 4)]).toEqual([
        ...sign(bytes.subarray(0, signatureAt)),
      ]);
      expect(view.getUint32(bytes.length - 4, true)).toBe(
        zlibCrc32(Buffer.from(bytes.subarray(0, bytes.length - 4))),
      );
      const read = verifyProfileFile(bytes);
      expect(read.header).toEqual(header());
      expect([...read.model]).toEqual([...model()]);
      expect(read.signature && [...read.signature]).toEqual([...sign(read.signedBytes)]);
      expect(read.signedBytes.length).toBe(signatureAt);
    });

    it('writes the unsigned layout 1, byte for byte, when there is no signer, and reads it as unsigned', () => {
      const unsigned = writeProfileFile(header(), model());
      const signed = writeProfileFile(header(), model(), sign);
      expect(new DataView(unsigned.buffer).getUint16(4, true)).toBe(1);
      expect(unsigned.length).toBe(signed.length - 32);
      // Same bytes up to the model's end, apart from the layout version.
      expect([...unsigned.subarray(6, unsigned.length - 4)]).toEqual([
        ...signed.subarray(6, unsigned.length - 4),
      ]);
      expect(readProfileFile(unsigned).signature).toBeNull();
    });

    it('tells a damaged signature by its CRC, and refuses a signer of the wrong length', () => {
      const bytes = writeProfileFile(header(), model(), sign);
      const damaged = bytes.slice();
      damaged[bytes.length - 10] ^= 1;
      expect(() => readProfileFile(damaged)).toThrow(/checksum does not match/);
      expect(() => readProfileFile(bytes.subarray(0, bytes.length - 32))).toThrow(/cut short/);
      expect(() => writeProfileFile(header(), model(), () => new Uint8Array(20))).toThrow(/32 bytes/);
    });
  });

  describe('layouts 3 and 4: the client’s word model after the PPM model', () => {
    const key = Buffer.from('another invented test key, 32 bytes or more', 'utf8');
    const sign = (bytes: Uint8Array) => new Uint8Array(createHmac('sha256', key).update(bytes).digest());
    const wordModel = trainWordModel([prepareText(text)]);
    const words = wordModel.toBytes();
    const withWeights = (): ProfileFileHeader => ({
      ...header(),
      wordWeights: { personal: 0.55, base: 0.3, lexicon: 0.05, cache: 0.1 },
    });

    it('round-trips the word model unsigned (layout 3) and signed (layout 4)', () => {
      for (const signer of [undefined, sign]) {
        const bytes = writeProfileFile(withWeights(), model(), signer, words);
        const view = new DataView(bytes.buffer);
        expect(view.getUint16(4, true)).toBe(
          signer ? PROFILE_FILE_SIGNED_WORDS_VERSION : PROFILE_FILE_WORDS_VERSION,
        );
        const read = verifyProfileFile(bytes);
        expect(read.header).toEqual(withWeights());
        expect([...read.model]).toEqual([...model()]);
        expect(read.words && [...read.words]).toEqual([...words]);
        expect(read.vocabularyWords).toBe(wordModel.vocabularySize);
        expect(read.vocabularyWords).toBeGreaterThan(30);
        const back = WordNgramModel.fromBytes(read.words as Uint8Array);
        expect(back.probability('<s>', '<s>', 'pepper')).toBe(wordModel.probability('<s>', '<s>', 'pepper'));
        expect(view.getUint32(bytes.length - 4, true)).toBe(
          zlibCrc32(Buffer.from(bytes.subarray(0, bytes.length - 4))),
        );
        if (signer) {
          // The signature covers the word model too: everything before it.
          expect(read.signedBytes.length).toBe(bytes.length - 4 - 32);
          expect(read.signature && [...read.signature]).toEqual([...sign(read.signedBytes)]);
        } else expect(read.signature).toBeNull();
      }
    });

    it('still reads layouts 1 and 2 written without words (words null)', () => {
      for (const signer of [undefined, sign]) {
        const read = verifyProfileFile(writeProfileFile(header(), model(), signer, null));
        expect(read.words).toBeNull();
        expect(read.vocabularyWords).toBe(0);
        expect(read.header.wordWeights).toBeUndefined();
      }
      expect(
        new DataView(writeProfileFile(header(), model(), undefined, null).buffer).getUint16(4, true),
      ).toBe(1);
    });

    it('refuses a word section cut short, with a clear message', () => {
      const bytes = writeProfileFile(withWeights(), model(), undefined, words);
      const wordsAt = bytes.length - 4 - words.length - 4;
      // Cut inside the word model's length field, then inside the word model.
      expect(() => readProfileFile(bytes.subarray(0, wordsAt + 2))).toThrow(/ends before its word model/);
      expect(() => readProfileFile(bytes.subarray(0, wordsAt + 4 + 10))).toThrow(
        /cut short: it should be \d+ bytes long/,
      );
      for (let cut = wordsAt; cut < bytes.length; cut += 13)
        expect(() => verifyProfileFile(bytes.subarray(0, cut)), `${cut} bytes`).toThrow(ProfileFileError);
    });

    it('refuses a good checksum over a word model that does not load', () => {
      const junk = writeProfileFile(withWeights(), model(), undefined, words.subarray(0, words.length - 1));
      expect(() => readProfileFile(junk)).not.toThrow();
      expect(() => verifyProfileFile(junk)).toThrow(/word model inside cannot be read/);
    });

    it('refuses any single changed byte of a file with words', () => {
      const bytes = writeProfileFile(withWeights(), model(), sign, words);
      for (let i = 0; i < bytes.length; i += 5) {
        const damaged = bytes.slice();
        damaged[i] ^= 0x10;
        expect(() => verifyProfileFile(damaged), `byte ${i}`).toThrow(ProfileFileError);
      }
    });
  });

  it('refuses a good checksum over a model that does not load', () => {
    const junk = writeProfileFile(header(), new Uint8Array([1, 2, 3, 4, 5]));
    expect(() => readProfileFile(junk)).not.toThrow();
    expect(() => verifyProfileFile(junk)).toThrow(/model inside cannot be read/);
  });
});
