// The base vocabulary: a word trigram model (modified Kneser–Ney) of all 500
// Brown documents, n-grams seen once left out, and the SUBTLEX-US word list
// without the pieces its tokeniser cut from contractions. Cached in
// corpora/.cache/base-words.bin. Node only (command line, bench, API, tests).
import { existsSync, mkdirSync, readFileSync, renameSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { FormatError, prepareText } from '@keyloom/shared';
import {
  deserializeBaseWords,
  serializeBaseWords,
  trainWordModel,
  WordLexicon,
  wordKey,
  type BaseWords,
} from '@keyloom/shared';
import { loadBrown } from './brown';
import { loadLexicon } from './lexicon';
import { cacheDir } from './paths';

const cacheFile = join(cacheDir, 'base-words.bin');
/** N-grams seen fewer times are left out of the base (count cut-off; keeps the download small). */
export const BASE_WORDS_MIN_COUNT = 2;

/**
 * SUBTLEX-US counts words split at apostrophes ("don't" → "don" + "t"). Left out (derived from
 * that tokenisation, checked against Brown, which keeps contractions whole):
 * - the pieces after an apostrophe: s, t, m, d, ll, re, ve;
 * - a piece before "'t" ("don", "didn", "isn") when Brown has "x't" at least ten times as often
 *   as "x" on its own (so "can" and "won" stay);
 * - other single letters, except "a", "i" and "o".
 */
export function subtlexWords(
  lexicon: ReadonlyMap<string, number>,
  brownCounts: ReadonlyMap<string, number>,
): [string, number][] {
  const clitics = new Set(['s', 't', 'm', 'd', 'll', 're', 've']);
  const out: [string, number][] = [];
  for (const [word, count] of lexicon) {
    const key = wordKey(word);
    if (clitics.has(key)) continue;
    if ([...key].length === 1 && !['a', 'i', 'o'].includes(key)) continue;
    const contracted = brownCounts.get(`${key}'t`) ?? 0;
    if (contracted > 0 && contracted >= 10 * (brownCounts.get(key) ?? 0)) continue;
    out.push([word, count]);
  }
  return out;
}

/** The Brown texts, one per document, prepared as the engine prepares any text. */
export function brownTexts(): Uint32Array[] {
  return loadBrown().documents.map((d) => prepareText(d.text));
}

/** Builds the base vocabulary from texts (Brown by default) and the SUBTLEX list. */
export function buildBaseWords(texts: readonly Uint32Array[] = brownTexts()): BaseWords {
  const full = trainWordModel(texts);
  const counts = new Map<string, number>();
  for (let id = 2; id < full.keys.length; id++) counts.set(full.keys[id], full.counts[id]);
  const ngram = full.pruned(BASE_WORDS_MIN_COUNT);
  const lexicon = WordLexicon.fromEntries(subtlexWords(loadLexicon(), counts));
  return { ngram, lexicon };
}

function readCached(): BaseWords | undefined {
  if (!existsSync(cacheFile)) return undefined;
  try {
    return deserializeBaseWords(new Uint8Array(readFileSync(cacheFile)));
  } catch (error) {
    if (error instanceof FormatError) return undefined; // damaged or older layout: rebuild
    throw error;
  }
}

export function baseWordsCacheIsFresh(): boolean {
  return readCached() !== undefined;
}

/** The base vocabulary's file bytes (builds the cache when missing). */
export function baseWordsFile(): string {
  loadBaseWords();
  return cacheFile;
}

/** The base vocabulary, frozen. Reads the cache, or builds and writes it. */
export function loadBaseWords(): BaseWords {
  const cached = readCached();
  if (cached) return cached;
  const built = buildBaseWords();
  mkdirSync(cacheDir, { recursive: true });
  const tmp = `${cacheFile}.${process.pid}.tmp`;
  writeFileSync(tmp, serializeBaseWords(built));
  renameSync(tmp, cacheFile);
  return built;
}
