import { describe, expect, it } from 'vitest';
import { Distribution, type NextSymbolModel } from '../model-types';
import { AddOneModel, LexiconModel, seededRandom } from './reference-models';
import { completionRank, nextLetterProbabilities, suggest } from './suggest';
import { charClass, CharClass, toCodePoints, wordStart } from './word-chars';

const ALPHABET = "ab'- .";

/** A small trained model with no exact probability ties. */
function tinyModel(seed: number): AddOneModel {
  const rnd = seededRandom(seed);
  const model = new AddOneModel(2, ALPHABET);
  let text = '';
  const weights = [0.3, 0.25, 0.05, 0.05, 0.25, 0.1];
  for (let i = 0; i < 400; i++) {
    let r = rnd();
    let k = 0;
    while (k < weights.length - 1 && r > weights[k]) r -= weights[k++];
    text += ALPHABET[k];
  }
  model.train(toCodePoints(text));
  return model;
}

/**
 * Naive oracle: enumerate every admissible completion up to `maxLen` code
 * points, score it by the chain rule, sort. Exponential, fine for 4 symbols.
 */
function exhaustive(
  model: NextSymbolModel,
  history: number[],
  slots: number,
  maxLen: number,
): { word: string; p: number }[] {
  const begin = wordStart(history, history.length);
  const prefix = String.fromCodePoint(...history.slice(begin));
  const words: { word: string; p: number }[] = [];
  const d = new Distribution();
  const visit = (path: number[], p: number): void => {
    const ctx = [...history, ...path];
    d.clear();
    model.distribution(ctx, ctx.length, d);
    const last = ctx.length > begin ? charClass(ctx[ctx.length - 1]) : CharClass.Boundary;
    let endMass = 0;
    for (let k = 0; k < d.size; k++)
      if (charClass(d.symbols[k]) === CharClass.Boundary) endMass += d.probs[k];
    if (last === CharClass.Word && ctx.length > begin)
      words.push({ word: prefix + String.fromCodePoint(...path), p: p * endMass });
    if (path.length === maxLen) return;
    // Copy: the recursion below reuses `d`.
    const symbols = [...d.symbols.subarray(0, d.size)];
    const probs = [...d.probs.subarray(0, d.size)];
    symbols.forEach((s, k) => {
      const c = charClass(s);
      if (c === CharClass.Boundary || (c === CharClass.Joiner && last !== CharClass.Word)) return;
      visit([...path, s], p * probs[k]);
    });
  };
  visit([], 1);
  return words.sort((a, b) => b.p - a.p).slice(0, slots);
}

describe('word characters', () => {
  it('classifies letters, accents, digits, joiners and boundaries', () => {
    const cls = (s: string): number => charClass(s.codePointAt(0) as number);
    for (const s of ['a', 'Z', 'é', 'ß', 'Ж', '7', '\u0301']) expect(cls(s)).toBe(CharClass.Word);
    for (const s of ["'", '’', '-']) expect(cls(s)).toBe(CharClass.Joiner);
    for (const s of [' ', '.', ',', '\n', '"', '😀']) expect(cls(s)).toBe(CharClass.Boundary);
  });

  it('finds the word in progress, joiners only inside', () => {
    const at = (s: string): number => wordStart(toCodePoints(s), toCodePoints(s).length);
    expect(at('hello wor')).toBe(6);
    expect(at("we don'")).toBe(3);
    expect(at('end. ')).toBe(5);
    expect(at("say 'em")).toBe(5);
    expect(at('café au')).toBe(5);
  });
});

describe('suggest', () => {
  // Oracle test: best-first search must equal exhaustive
  // enumeration when its budget is not binding.
  const limits = { nodeBudget: 1_000_000, maxCompletionLength: 6 };
  for (const seed of [1, 2, 3]) {
    for (const context of ['', 'ab ', 'ab a', "ba b'", 'a.b-']) {
      it(`matches the exhaustive oracle (seed ${seed}, context ${JSON.stringify(context)})`, () => {
        const model = tinyModel(seed);
        const history = [...toCodePoints(context)];
        const got = suggest(model, history, history.length, 8, limits);
        const want = exhaustive(model, history, 8, 6);
        expect(got.map((s) => s.word)).toEqual(want.map((s) => s.word));
        got.forEach((s, i) => expect(s.p).toBeCloseTo(want[i].p, 14));
      });
    }
  }

  it('ranks without duplicates and with descending probabilities', () => {
    const model = tinyModel(7);
    const got = suggest(model, [], 0, 20, limits);
    expect(new Set(got.map((s) => s.word)).size).toBe(got.length);
    for (let i = 1; i < got.length; i++) expect(got[i].p).toBeLessThanOrEqual(got[i - 1].p);
  });

  it('returns the lexicon ranking of the hand-worked example', () => {
    // A hand-made toy lexicon (derived by hand; docs/references.md §2): the 5, cat 4, then 3, there 2, car 1.
    const model = new LexiconModel(
      new Map([
        ['the', 5],
        ['cat', 4],
        ['then', 3],
        ['there', 2],
        ['car', 1],
      ]),
    );
    const at = (s: string): string[] =>
      suggest(model, toCodePoints(s), toCodePoints(s).length, 5).map((x) => x.word);
    expect(at('')).toEqual(['the', 'cat', 'then', 'there', 'car']);
    expect(at('then c')).toEqual(['cat', 'car']);
    const p = suggest(model, [], 0, 1)[0].p;
    expect(p).toBeCloseTo(5 / 15, 12);
  });

  it('respects the node budget', () => {
    const model = tinyModel(4);
    let calls = 0;
    const counting: NextSymbolModel = {
      order: model.order,
      distribution: (h, e, out) => {
        calls++;
        model.distribution(h, e, out);
      },
      probability: (h, e, s) => model.probability(h, e, s),
      learn: () => undefined,
    };
    suggest(counting, [], 0, 50, { nodeBudget: 25, maxCompletionLength: 10 });
    expect(calls).toBeLessThanOrEqual(25);
  });
});

describe('completionRank', () => {
  it('equals the position in the suggestion list', () => {
    const model = tinyModel(5);
    const limits = { nodeBudget: 200, maxCompletionLength: 8 };
    for (const context of ['', 'a', 'ab b', "b'", 'ba-a']) {
      const history = toCodePoints(context);
      const begin = wordStart(history, history.length);
      const list = suggest(model, history, history.length, 10, limits);
      list.forEach((s, i) => {
        const completion = toCodePoints(s.word).subarray(history.length - begin);
        expect(completionRank(model, history, history.length, completion, 10, limits)).toBe(i + 1);
      });
      // A word outside the list has rank 0.
      const absent = toCodePoints('abababab');
      if (!list.some((s) => s.word.endsWith('abababab'))) {
        expect(completionRank(model, history, history.length, absent, 10, limits)).toBe(0);
      }
    }
  });
});

describe('nextLetterProbabilities', () => {
  it('returns the word-character part of the distribution, case-folded on request', () => {
    const model = new AddOneModel(1, 'aAb .');
    model.train(toCodePoints('aa Ab ab. AA'));
    const h = toCodePoints('a');
    const plain = nextLetterProbabilities(model, h, 1);
    expect(plain.map((x) => x.char).sort()).toEqual(['A', 'a', 'b']);
    const folded = nextLetterProbabilities(model, h, 1, { foldCase: true });
    const pa = model.probability(h, 1, 0x61) + model.probability(h, 1, 0x41);
    expect(folded.find((x) => x.char === 'a')?.p).toBeCloseTo(pa, 14);
    const all = nextLetterProbabilities(model, h, 1, { includeBoundaries: true });
    expect(all.reduce((s, x) => s + x.p, 0)).toBeCloseTo(1, 12);
  });
});
