// The base vocabulary as one file (corpora/.cache/base-words.bin, and the
// test keyboard's one-time download beside the base model):
//   magic 8B 4B 4C 42 (0x8B "KLB"), version 1, u32 length + the base corpus's word model
//   (WordNgramModel layout), u32 length + the word list (WordLexicon layout, length 0 = none),
//   CRC-32 of every byte before it.
import { ByteReader, ByteWriter, FormatError } from '../byte-io';
import { crc32 } from '../crc32';
import { WordLexicon } from './word-lexicon';
import { WordNgramModel } from './word-ngram-model';
import type { BaseWords } from './word-predictor';

const MAGIC = [0x8b, 0x4b, 0x4c, 0x42];
const VERSION = 1;

export function serializeBaseWords(base: BaseWords): Uint8Array {
  const w = new ByteWriter();
  for (const b of MAGIC) w.u8(b);
  w.u8(VERSION);
  const ngram = base.ngram.toBytes();
  w.u32(ngram.length);
  w.raw(ngram);
  const lexicon = base.lexicon ? base.lexicon.toBytes() : new Uint8Array(0);
  w.u32(lexicon.length);
  w.raw(lexicon);
  w.u32(crc32(w.result()));
  return w.result();
}

/** @throws FormatError naming what is wrong (damage, another file, a newer layout) */
export function deserializeBaseWords(bytes: Uint8Array): BaseWords {
  if (bytes.length < 17) throw new FormatError('base vocabulary: too short');
  for (let i = 0; i < 4; i++)
    if (bytes[i] !== MAGIC[i])
      throw new FormatError('base vocabulary: not a Keyloom base vocabulary (wrong magic)');
  const stored = new ByteReader(bytes.subarray(bytes.length - 4)).u32();
  if (crc32(bytes.subarray(0, bytes.length - 4)) !== stored)
    throw new FormatError('base vocabulary: damaged (CRC-32 does not match)');
  const r = new ByteReader(bytes, bytes.length - 4);
  r.position = 4;
  const version = r.u8();
  if (version !== VERSION) throw new FormatError(`base vocabulary: layout ${version} is not supported`);
  const part = (): Uint8Array => {
    const n = r.u32();
    if (n > r.remaining) throw new FormatError('base vocabulary: damaged (a part runs past the end)');
    const b = bytes.subarray(r.position, r.position + n);
    r.position += n;
    return b;
  };
  const ngram = WordNgramModel.fromBytes(part());
  ngram.adaptive = false;
  const lex = part();
  if (r.remaining !== 0) throw new FormatError('base vocabulary: damaged (bytes left over)');
  return { ngram, lexicon: lex.length === 0 ? null : WordLexicon.fromBytes(lex) };
}
