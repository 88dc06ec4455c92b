// How many offered slots are not words: the lists a predictor shows at the
// start of each word of a text and after each of its first two letters,
// checked against a vocabulary. The word-aware list offers only vocabulary
// words by construction; this measures it from outside (and shows how many
// fragments the character-only list offers).
import { CharClass, charClass } from '../search/word-chars';
import { wordEndAt } from '../words/word-tokens';
import type { ListPredictor } from '../words/word-predictor';

export type OfferedWordsResult = {
  lists: number;
  slots: number;
  /** Offered strings that are not words of the vocabulary. */
  nonWordSlots: number;
  /** Lists holding at least one such string. */
  listsWithNonWord: number;
  /** nonWordSlots / slots (0 when nothing was offered). */
  nonWordShare: number;
  /** Up to 10 of the non-words offered, in order of first appearance. */
  examples: string[];
};

/**
 * @param isWord true for a word of the vocabulary (as offered, any case)
 * @param maxWords words of the text visited at most (three lists each)
 */
export function offeredNonWords(
  predictor: ListPredictor,
  isWord: (word: string) => boolean,
  text: ArrayLike<number>,
  slots: number,
  maxWords = 300,
): OfferedWordsResult {
  let lists = 0;
  let offered = 0;
  let nonWords = 0;
  let listsWithNonWord = 0;
  const examples: string[] = [];
  let words = 0;
  let i = 0;
  while (i < text.length && words < maxWords) {
    if (charClass(text[i]) !== CharClass.Word) {
      i++;
      continue;
    }
    const j = wordEndAt(text, i);
    for (let typed = 0; typed <= Math.min(2, j - i - 1); typed++) {
      const list = predictor.suggest(text, i + typed, slots);
      lists++;
      let bad = 0;
      for (const s of list) {
        offered++;
        if (!isWord(s.word)) {
          bad++;
          if (examples.length < 10 && !examples.includes(s.word)) examples.push(s.word);
        }
      }
      nonWords += bad;
      if (bad > 0) listsWithNonWord++;
    }
    words++;
    i = j;
  }
  return {
    lists,
    slots: offered,
    nonWordSlots: nonWords,
    listsWithNonWord,
    nonWordShare: offered === 0 ? 0 : nonWords / offered,
    examples,
  };
}
