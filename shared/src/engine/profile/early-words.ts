// Words the personal profile offers early (in the list before their first or
// second letter is typed) where the base model alone would not: the client's
// own words, shown to the clinician as what the personal text adds.
import { stringFromCodePoints } from '../text-preparation';
import type { WordVisit } from '../evaluation/keystroke-savings';

/** A word counts as offered early when the list showed it after at most this many typed letters. */
export const EARLY_LETTERS = 1;

export type { EarlyWord } from '../../schemas/profile-report.schema';
import type { EarlyWord } from '../../schemas/profile-report.schema';

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
 * (same text, same word positions).
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
