import { ServiceUnavailableException } from '@nestjs/common';
import { type BaseWords, deserializeBaseWords, type KnownWords, MisspellingIndex } from '@keyloom/shared';
import { readFile } from 'node:fs/promises';
import { BASE_WORDS_FILE } from '../profile-versions/profile-training';

export const BASE_VOCABULARY_MISSING_MESSAGE =
  'The base vocabulary is not on this server yet. Ask the administrator to build it (npm run corpora).';

/** The base vocabulary as the listing and the misspelling review read it. */
export type BaseVocabulary = KnownWords & {
  /** The misspelling index over it, built on first use (a second or so), then kept. */
  index(): MisspellingIndex;
};

/** Known words of a base vocabulary: its word model's words or its word list's (frequency per million). */
export function knownWordsOf(base: BaseWords): BaseVocabulary {
  const lexicon = base.lexicon;
  let index: MisspellingIndex | null = null;
  const known: BaseVocabulary = {
    has: (key) => base.ngram.has(key) || (lexicon !== null && lexicon.idOf(key) >= 0),
    frequency: (key) => (lexicon ? lexicon.probability(key) * 1e6 : 0),
    keys: lexicon ? lexicon.keys : [],
    index: () => (index ??= new MisspellingIndex(known)),
  };
  return known;
}

/**
 * The base vocabulary file (the one the test keyboard downloads, BASE_WORDS_FILE), read once per
 * process on first use. A missing or unreadable file is 503 and is read again on the next call.
 */
export class BaseVocabularyLoader {
  private loaded: Promise<BaseVocabulary> | null = null;

  constructor(private readonly file = BASE_WORDS_FILE) {}

  load(): Promise<BaseVocabulary> {
    this.loaded ??= readFile(this.file)
      .then((bytes) => knownWordsOf(deserializeBaseWords(new Uint8Array(bytes))))
      .catch(() => {
        this.loaded = null;
        throw new ServiceUnavailableException(BASE_VOCABULARY_MISSING_MESSAGE);
      });
    return this.loaded;
  }
}
