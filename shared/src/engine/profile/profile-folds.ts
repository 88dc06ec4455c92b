// Cross-validation folds of a profile: by document when there are at least
// as many documents as folds, otherwise by contiguous segments of the text.
import { kFoldSplits } from '../evaluation/cross-validation';
import { ProfileInputError } from './profile-errors';

/** Line feed: joins documents (and test documents of a fold) into one text. */
const LF = 0x0a;

export type PreparedDocument = { id: string; text: Uint32Array };

export type ProfileFold = {
  /** Texts the fold's model learns, each on its own (no context across them). */
  train: Uint32Array[];
  /** The held-out text: the fold's test documents joined with a line feed. */
  test: Uint32Array;
  /** Ids of the held-out documents (empty for segment folds). */
  testIds: string[];
};

export type FoldPlan = { unit: 'document' | 'segment'; folds: ProfileFold[]; note: string };

/** Joins texts with a line feed between them. */
export function joinTexts(texts: readonly Uint32Array[]): Uint32Array {
  const total = texts.reduce((n, t) => n + t.length, 0) + Math.max(0, texts.length - 1);
  const out = new Uint32Array(total);
  let at = 0;
  texts.forEach((t, i) => {
    if (i > 0) out[at++] = LF;
    out.set(t, at);
    at += t.length;
  });
  return out;
}

function isSpace(c: number): boolean {
  return c === 0x20 || c === LF || c === 0x09;
}

/**
 * Cuts `text` into k contiguous parts of about equal length, each cut moved
 * back to the nearest whitespace (so no word is split) unless that would
 * leave a part empty.
 */
export function contiguousParts(text: Uint32Array, k: number): Uint32Array[] {
  const cuts = [0];
  for (let f = 1; f < k; f++) {
    const goal = Math.round((f * text.length) / k);
    let cut = goal;
    while (cut > cuts[f - 1] + 1 && !isSpace(text[cut])) cut--;
    if (cut <= cuts[f - 1] + 1) cut = goal;
    cuts.push(cut);
  }
  cuts.push(text.length);
  const parts: Uint32Array[] = [];
  for (let f = 0; f < k; f++) parts.push(text.subarray(cuts[f], cuts[f + 1]));
  return parts;
}

/**
 * The k folds. By document: document d is tested in fold d mod k (kFoldSplits).
 * With fewer documents than folds: all documents joined, cut into k contiguous
 * segments, each tested once.
 * @param k folds, 2..10
 */
export function planFolds(documents: readonly PreparedDocument[], k: number): FoldPlan {
  if (!Number.isInteger(k) || k < 2 || k > 10) throw new ProfileInputError(`folds must be 2..10, got ${k}`);
  if (documents.length >= k) {
    const folds = kFoldSplits(documents, k).map(({ train, test }) => ({
      train: train.map((d) => d.text),
      test: joinTexts(test.map((d) => d.text)),
      testIds: test.map((d) => d.id),
    }));
    return {
      unit: 'document',
      folds,
      note:
        `Whole samples are held out: samples 1, ${k + 1}, ${2 * k + 1} … are tested in fold 1, ` +
        `samples 2, ${k + 2}, ${2 * k + 2} … in fold 2, and so on.`,
    };
  }
  const parts = contiguousParts(joinTexts(documents.map((d) => d.text)), k);
  return {
    unit: 'segment',
    folds: parts.map((test, f) => ({ train: parts.filter((_, g) => g !== f), test, testIds: [] })),
    note:
      `Only ${documents.length} sample(s) for ${k} folds: the text of all samples was cut into ${k} ` +
      'consecutive parts and each part tested once, so a tested part may come from the same sample as training text.',
  };
}

/**
 * The leading part of `text` the keystroke simulation types: at most `cap`
 * characters, cut back to a whitespace so no word is split. null = no cap.
 */
export function keystrokeSample(text: Uint32Array, cap: number | null): Uint32Array {
  if (cap === null || text.length <= cap) return text;
  let cut = cap;
  while (cut > 0 && !isSpace(text[cut])) cut--;
  return text.subarray(0, cut === 0 ? cap : cut);
}
