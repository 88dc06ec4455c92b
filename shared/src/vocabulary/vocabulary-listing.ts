// A client's personal vocabulary as the clinician reviews it: one entry per word key, cut exactly
// as training cuts words (engine/words/word-tokens.ts), and the word pairs within sentences.
// Linear in the text: one pass of sentencesOf per document.
import { prepareText } from '../engine/text-preparation';
import { isOfferable, sentencesOf } from '../engine/words/word-tokens';

export type VocabularyDocument = { id: string; text: string };

/** One word of the client's vocabulary. */
export type VocabularyEntry = {
  /** Counting key (lower case, ’ → ', ‐ → -): what the list matches typed letters against. */
  key: string;
  /** The commonest written form inside sentences (where a capital means something), else the commonest form. */
  form: string;
  /** Times written, over every document. */
  count: number;
  /** The documents it occurs in, in the given order, with the times in each. */
  documents: { id: string; count: number }[];
  /** Id of the first and the last document (in the given order) it occurs in. */
  firstDocument: string;
  lastDocument: string;
  /** Whether the base vocabulary (base words or word list) knows it, by the given function. */
  inBase: boolean;
};

export type VocabularyOptions = {
  /** Prepare as the profile does: lower case everything (then every form is lower case). */
  caseFold: boolean;
  /** Membership in the base vocabulary, by key; none given: every entry reads inBase false. */
  inBase?: (key: string) => boolean;
};

type Tally = {
  count: number;
  forms: Map<string, number>;
  midForms: Map<string, number>;
  documents: { id: string; count: number }[];
};

function commonest(forms: Map<string, number>): string | undefined {
  let best: string | undefined;
  let bestCount = 0;
  for (const [form, n] of forms)
    if (n > bestCount || (n === bestCount && best !== undefined && form < best)) {
      best = form;
      bestCount = n;
    }
  return best;
}

/** Sorted by count (most first), then key: the order every listing and export uses. */
function byCountThenKey(a: { count: number; key: string }, b: { count: number; key: string }): number {
  return b.count - a.count || (a.key < b.key ? -1 : a.key > b.key ? 1 : 0);
}

/** Tallies every offerable word; calls `pair` for each two offerable words next to each other in a sentence. */
function tally(
  documents: readonly VocabularyDocument[],
  caseFold: boolean,
  pair?: (previous: string, word: string) => void,
): Map<string, Tally> {
  const words = new Map<string, Tally>();
  for (const d of documents) {
    for (const sentence of sentencesOf(prepareText(d.text, { caseFold }))) {
      let previous: string | null = null;
      for (const t of sentence) {
        if (!isOfferable(t.key)) {
          previous = null; // punctuation, numbers and placeholders are not words: no pair across them
          continue;
        }
        let w = words.get(t.key);
        if (!w) words.set(t.key, (w = { count: 0, forms: new Map(), midForms: new Map(), documents: [] }));
        w.count++;
        w.forms.set(t.form, (w.forms.get(t.form) ?? 0) + 1);
        if (!t.sentenceStart) w.midForms.set(t.form, (w.midForms.get(t.form) ?? 0) + 1);
        const last = w.documents[w.documents.length - 1];
        if (last && last.id === d.id) last.count++;
        else w.documents.push({ id: d.id, count: 1 });
        if (pair && previous !== null) pair(previous, t.key);
        previous = t.key;
      }
    }
  }
  return words;
}

function formOf(w: Tally): string {
  return (commonest(w.midForms) ?? commonest(w.forms)) as string;
}

/**
 * The client's vocabulary: one entry per offerable word key (no numbers, no single letters other
 * than a and I, no redaction placeholders), most written first. `documents` in the order the caller
 * means by first and last (the API passes samples oldest first).
 */
export function vocabularyOf(
  documents: readonly VocabularyDocument[],
  options: VocabularyOptions,
): VocabularyEntry[] {
  const inBase = options.inBase ?? (() => false);
  const out: VocabularyEntry[] = [];
  for (const [key, w] of tally(documents, options.caseFold))
    out.push({
      key,
      form: formOf(w),
      count: w.count,
      documents: w.documents,
      firstDocument: w.documents[0].id,
      lastDocument: w.documents[w.documents.length - 1].id,
      inBase: inBase(key),
    });
  return out.sort(byCountThenKey);
}

/** Two words written one after the other inside a sentence, as their commonest forms. */
export type WordPair = { previous: string; word: string; count: number };

/**
 * Consecutive offerable words within a sentence (sentences cut as training cuts them; a comma,
 * quote, bracket, number or placeholder between two words breaks the pair), most frequent first.
 */
export function wordPairsOf(
  documents: readonly VocabularyDocument[],
  options: { caseFold: boolean },
): WordPair[] {
  const pairs = new Map<string, { previous: string; word: string; count: number }>();
  const words = tally(documents, options.caseFold, (previous, word) => {
    const id = `${previous}\u0000${word}`;
    const p = pairs.get(id);
    if (p) p.count++;
    else pairs.set(id, { previous, word, count: 1 });
  });
  const form = (key: string): string => formOf(words.get(key) as Tally);
  return [...pairs.values()]
    .map((p) => ({
      previous: form(p.previous),
      word: form(p.word),
      count: p.count,
      key: `${p.previous} ${p.word}`,
    }))
    .sort(byCountThenKey)
    .map(({ previous, word, count }) => ({ previous, word, count }));
}
