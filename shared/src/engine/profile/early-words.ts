// Words the personal profile offers early (in the list before their first or
// second letter is typed) where the base model alone would not: the client's
// own words, shown to the clinician as what the personal text adds.
import { stringFromCodePoints } from '../text-preparation';
import type { WordVisit } from '../evaluation/keystroke-savings';

/** A word counts as offered early when the list showed it after at most this many typed letters. */
export const EARLY_LETTERS = 1;

export type { EarlyWord } from '../../schemas/profile-report.schema';
import type { EarlyWord } from '../../schemas/profile-report.schema';

/** Shortest word, in letters, worth listing as offered early. */
export const EARLY_MIN_LETTERS = 3;

/**
 * Whether a word belongs in the list of words offered early: no digits (numbers and
 * codes say nothing about the client's vocabulary) and at least EARLY_MIN_LETTERS letters
 * (the shortest words are offered early by almost any model).
 */
export function isListableEarlyWord(word: string): boolean {
  if (/\p{Nd}/u.test(word)) return false;
  return (word.match(/\p{L}/gu)?.length ?? 0) >= EARLY_MIN_LETTERS;
}

/** Collects, for one text, which word occurrences a model offered early at `slots`. */
export class EarlyWordRecorder {
  /** Start positions of words offered early. */
  readonly early = new Set<number>();
  /** Start → end of every word seen. */
  readonly spans = new Map<number, number>();

  constructor(private readonly slots: number) {}

  record(visit: WordVisit): void {
    this.spans.set(visit.start, visit.end);
    const at = visit.firstShownAt[this.slots];
    if (at >= 0 && at <= EARLY_LETTERS) this.early.add(visit.start);
  }
}

/**
 * Adds to `counts` the words the profile offered early and the base did not
 * (same text, same word positions), leaving out numbers and short words (isListableEarlyWord).
 */
export function countEarlyWords(
  text: ArrayLike<number>,
  profile: EarlyWordRecorder,
  base: EarlyWordRecorder,
  counts: Map<string, number>,
): void {
  for (const start of profile.early) {
    if (base.early.has(start)) continue;
    const word = stringFromCodePoints(text, start, profile.spans.get(start) ?? start);
    if (!isListableEarlyWord(word)) continue;
    counts.set(word, (counts.get(word) ?? 0) + 1);
  }
}

/** Most frequent first, then alphabetical (code-unit order, so the list is deterministic). */
export function topEarlyWords(counts: Map<string, number>, limit: number): EarlyWord[] {
  return [...counts.entries()]
    .map(([word, count]) => ({ word, count }))
    .sort((a, b) => b.count - a.count || (a.word < b.word ? -1 : a.word > b.word ? 1 : 0))
    .slice(0, limit);
}
