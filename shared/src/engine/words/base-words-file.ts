// The base vocabulary as one file (corpora/.cache/base-words.bin, and the
// test keyboard's one-time download beside the base model):
//   magic 8B 4B 4C 42 (0x8B "KLB"), version 1, u32 length + the base corpus's word model
//   (WordNgramModel layout), u32 length + the word list (WordLexicon layout, length 0 = none),
//   CRC-32 of every byte before it.
import { FormatError } from '../byte-io';
import {
  closeFrame,
  closeFrameReader,
  type FrameKind,
  openFrameReader,
  openFrameWriter,
} from './framed-file';
import { WordLexicon } from './word-lexicon';
import { WordNgramModel } from './word-ngram-model';
import type { BaseWords } from './word-predictor';

/** 0x8B "KLB", version 1. */
const FRAME: FrameKind = {
  magic: [0x8b, 0x4b, 0x4c, 0x42],
  version: 1,
  what: 'base vocabulary',
  minBytes: 17,
};

export function serializeBaseWords(base: BaseWords): Uint8Array {
  const w = openFrameWriter(FRAME);
  for (const part of [base.ngram.toBytes(), base.lexicon ? base.lexicon.toBytes() : new Uint8Array(0)]) {
    w.u32(part.length);
    w.raw(part);
  }
  return closeFrame(w);
}

/** @throws FormatError naming what is wrong (damage, another file, a newer layout) */
export function deserializeBaseWords(bytes: Uint8Array): BaseWords {
  const r = openFrameReader(bytes, FRAME);
  const part = (): Uint8Array => {
    const n = r.u32();
    if (n > r.remaining) throw new FormatError('base vocabulary: damaged (a part runs past the end)');
    return r.take(n);
  };
  const ngram = WordNgramModel.fromBytes(part());
  ngram.adaptive = false;
  const lex = part();
  closeFrameReader(r, FRAME);
  return { ngram, lexicon: lex.length === 0 ? null : WordLexicon.fromBytes(lex) };
}
