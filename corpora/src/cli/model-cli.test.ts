import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { model } from './run-model';
import { loadBaseModel } from '../base-model';
import { prepareText } from '@keyloom/shared';
import { freshModel, trainPersonalModel, tuneBaseWeightOnTail } from '@keyloom/shared';
import { suggest } from '@keyloom/shared';

// The command line is a contract: spawn it exactly as users do.
const dir = mkdtempSync(join(tmpdir(), 'keyloom-cli-'));
const train = join(dir, 'train.txt');
const test = join(dir, 'test.txt');
const binary = join(dir, 'binary.dat');
const badUtf8 = join(dir, 'bad.txt');
const testText = 'Pepper and I took the boat out this morning. The wind was good.\n';

beforeAll(() => {
  // Invented demo text (the Willowmere demo scenario), not from any corpus.
  const lines = [
    'Pepper and I went down to the harbour this morning.',
    'The wind was good so we took the boat out past the point.',
    'Pepper sat in the bow and barked at the gulls the whole way.',
    'In the evening I played some jazz on the piano for my sister.',
    'She says my left hand is getting stronger every week.',
  ];
  writeFileSync(train, lines.join('\n').repeat(20));
  writeFileSync(test, testText);
  writeFileSync(binary, Buffer.from([0x4b, 0x00, 0x4c, 0x00]));
  writeFileSync(badUtf8, Buffer.from([0x61, 0x62, 0xc3, 0x28, 0x63]));
});

describe('model evaluate', () => {
  it('prints exactly the contract keys with --json', () => {
    const r = model('evaluate', '--train', train, '--test', test, '--order', '4', '--escape', 'D', '--json');
    expect(r.status).toBe(0);
    const out = JSON.parse(r.stdout) as Record<string, unknown>;
    expect(Object.keys(out).sort()).toEqual(
      [
        'adaptive',
        'baseWeight',
        'nonWordSlots',
        'predictor',
        'wordWeights',
        'bpcCoded',
        'bpcIdeal',
        'chars',
        'codedBytes',
        'escape',
        'keystrokeSavings',
        'kspc',
        'ms',
        'order',
        'roundTrip',
        'scanStepsPerChar',
        'scanStepsByLayout',
      ].sort(),
    );
    expect(out.chars).toBe([...testText].length);
    expect(out.order).toBe(4);
    expect(out.escape).toBe('D');
    expect(out.roundTrip).toBe(true);
    expect(out.adaptive).toBe(true);
    expect(out.baseWeight).toBe(0);
    expect(out.predictor).toBe('word');
    const weights = out.wordWeights as Record<string, number>;
    expect(Object.keys(weights).sort()).toEqual(['base', 'cache', 'lexicon', 'personal']);
    // No base: the base and word-list components are absent; the rest sum to 1.
    expect(weights.base).toBe(0);
    expect(weights.lexicon).toBe(0);
    expect(weights.personal + weights.cache).toBeCloseTo(1, 5);
    const ks = out.keystrokeSavings as Record<string, number>;
    const kspc = out.kspc as Record<string, number>;
    expect(Object.keys(ks)).toEqual(['1', '2', '3', '4', '5', '6', '7', '8', '9', '10']);
    for (let w = 1; w <= 10; w++) expect(ks[w] + kspc[w]).toBeCloseTo(1, 5);
    expect(ks['10']).toBeGreaterThan(0.3); // the test text repeats the training phrases
    expect(Object.keys(out.scanStepsPerChar as object).sort()).toEqual(['modelOrdered', 'rowColumn']);
    const byLayout = out.scanStepsByLayout as Record<string, number>;
    expect(Object.keys(byLayout).sort()).toEqual(['alphabetical', 'model-ordered', 'typewriter']);
    expect(byLayout['model-ordered']).toBeLessThanOrEqual(byLayout.alphabetical);
    // Real coded stream: within a few bytes of the ideal length (WNC87 bound, docs/references.md §1).
    expect(Math.abs((out.bpcCoded as number) - (out.bpcIdeal as number)) * testText.length).toBeLessThan(40);
  });

  it('prints a readable summary without --json', () => {
    const r = model('evaluate', '--train', train, '--test', test, '--adaptive', 'off');
    expect(r.status).toBe(0);
    expect(r.stdout).toMatch(/Bits per character/);
    expect(r.stdout).toMatch(/static/);
  });

  it('exits with 2 and one line on a bad argument', () => {
    const r = model('evaluate', '--train', train, '--test', test, '--escape', 'Q');
    expect(r.status).toBe(2);
    expect(r.stderr.trim().split('\n')).toHaveLength(1);
    expect(r.stderr).toMatch(/--escape/);
  });

  it('exits with 2 on non-text files, naming them', () => {
    const nul = model('evaluate', '--train', binary, '--test', test);
    expect(nul.status).toBe(2);
    expect(nul.stderr).toContain(binary);
    const bad = model('evaluate', '--train', train, '--test', badUtf8, '--json');
    expect(bad.status).toBe(2);
    expect(bad.stderr).toMatch(/UTF-8/);
    const missing = model('evaluate', '--train', join(dir, 'nope.txt'), '--test', test);
    expect(missing.status).toBe(2);
  });
});

describe('model suggest', () => {
  it('prints a ranked JSON array of {word, p}', () => {
    const r = model(
      'suggest',
      '--train',
      train,
      '--context',
      'Pepper sat in the b',
      '--slots',
      '3',
      '--json',
    );
    expect(r.status).toBe(0);
    const list = JSON.parse(r.stdout) as { word: string; p: number }[];
    expect(list.length).toBeGreaterThan(0);
    expect(list.length).toBeLessThanOrEqual(3);
    expect(list[0].word).toBe('bow');
    for (const s of list) {
      expect(Object.keys(s).sort()).toEqual(['p', 'word']);
      expect(s.word.startsWith('b')).toBe(true);
    }
    for (let i = 1; i < list.length; i++) expect(list[i].p).toBeLessThanOrEqual(list[i - 1].p);
  });

  it('exits with 2 on a bad --slots', () => {
    const r = model('suggest', '--train', train, '--context', 'the', '--slots', 'many');
    expect(r.status).toBe(2);
    expect(r.stderr).toMatch(/--slots/);
  });
});

// A training text that names one person often, built from a sentence pattern (no prose kept here).
const bertram = join(dir, 'bertram.txt');
// A base corpus with a word no other text here has.
const otherBase = join(dir, 'other-base.txt');
const verbs = ['called', 'visited', 'helped', 'thanked', 'asked', 'met'];
const times = ['today', 'on Monday', 'after lunch', 'this week', 'again'];

beforeAll(() => {
  const lines: string[] = [];
  for (let round = 0; round < 4; round++)
    for (const v of verbs)
      for (const t of times) lines.push(`I ${v} Bertram ${t}.`, `We ${v} the nurse ${t}.`);
  writeFileSync(bertram, lines.join('\n'));
  writeFileSync(
    otherBase,
    verbs
      .map((v) => `The ${v} zorbanite shone.`)
      .join('\n')
      .repeat(3),
  );
});

type Offer = { word: string; p: number };
const words = (stdout: string): string[] => (JSON.parse(stdout) as Offer[]).map((s) => s.word);

describe('model suggest --predictor', () => {
  it('offers a name the training text uses often, by default as a whole word', () => {
    const r = model('suggest', '--train', bertram, '--base', 'brown', '--context', 'Please ask Be', '--json');
    expect(r.status).toBe(0);
    const list = words(r.stdout);
    expect(list).toContain('Bertram');
    expect(list.length).toBe(5);
    for (const w of list) expect(w.startsWith('Be')).toBe(true);
  });

  it('--predictor char is the character-only list, as the engine computes it', () => {
    const r = model(
      'suggest',
      '--train',
      bertram,
      '--base',
      'brown',
      '--context',
      'Please ask Be',
      '--predictor',
      'char',
      '--json',
    );
    expect(r.status).toBe(0);
    // The same list computed in this process from the pieces the command used before the word list.
    const settings = { order: 5, escape: 'C' as const, exclusion: true, adaptive: true };
    const texts = [prepareText(readFileSync(bertram, 'utf8'))];
    const personal = trainPersonalModel(settings, texts);
    const base = loadBaseModel();
    const model5 = freshModel(personal, base, tuneBaseWeightOnTail(settings, texts, base), false);
    const history = prepareText('Please ask Be');
    const expected = suggest(model5, history, history.length, 5).map((s) => s.word);
    expect(expected.length).toBe(5);
    expect(words(r.stdout)).toEqual(expected);
  }, 60_000);

  it('--base-corpus builds the base from the given file', () => {
    const context = ['--context', 'I saw the zo', '--json'];
    const own = model('suggest', '--train', bertram, '--base-corpus', otherBase, ...context);
    expect(own.status).toBe(0);
    expect(words(own.stdout)).toContain('zorbanite');
    // With the Brown base instead, the word is unknown and never offered.
    const brown = model('suggest', '--train', bertram, '--base', 'brown', ...context);
    expect(brown.status).toBe(0);
    expect(words(brown.stdout)).not.toContain('zorbanite');
    expect(words(brown.stdout).length).toBeGreaterThan(0);
  });

  it('exits with 2 and one line on bad values', () => {
    const cases: [string[], RegExp][] = [
      [['--predictor', 'letters'], /--predictor/],
      [['--base', 'brown', '--base-corpus', otherBase], /--base-corpus/],
      [['--base-corpus', join(dir, 'missing.txt')], /missing\.txt/],
      [['--base-corpus', binary], /NUL/],
      [['--base-corpus'], /--base-corpus/],
    ];
    for (const [args, message] of cases) {
      const r = model('suggest', '--train', train, '--context', 'the', ...args);
      expect(r.status, args.join(' ')).toBe(2);
      expect(r.stderr.trim().split('\n')).toHaveLength(1);
      expect(r.stderr).toMatch(message);
    }
    // An empty training file and no base: nothing to offer words from.
    const empty = join(dir, 'empty.txt');
    writeFileSync(empty, '');
    const none = model('suggest', '--train', empty, '--context', 'the');
    expect(none.status).toBe(2);
    expect(none.stderr.trim().split('\n')).toHaveLength(1);
    expect(none.stderr).toMatch(/training text or a base/);
    const e = model('evaluate', '--train', train, '--test', test, '--predictor', 'both');
    expect(e.status).toBe(2);
    expect(e.stderr.trim().split('\n')).toHaveLength(1);
  });
});

describe('model evaluate --predictor', () => {
  const nonWords = (predictor: string): { nonWordSlots: number; slots: number; examples: string[] } => {
    const r = model('evaluate', '--train', bertram, '--test', test, '--predictor', predictor, '--json');
    expect(r.status).toBe(0);
    const out = JSON.parse(r.stdout) as {
      predictor: string;
      wordWeights: unknown;
      nonWordSlots: { nonWordSlots: number; slots: number; examples: string[] };
    };
    expect(out.predictor).toBe(predictor);
    expect(out.wordWeights === null).toBe(predictor === 'char');
    return out.nonWordSlots;
  };

  it('counts offered non-words: none for the word list, some for the character-only list', () => {
    const word = nonWords('word');
    expect(word.slots).toBeGreaterThan(50);
    expect(word.nonWordSlots).toBe(0);
    expect(word.examples).toEqual([]);
    const char = nonWords('char');
    expect(char.slots).toBeGreaterThan(50);
    expect(char.nonWordSlots).toBeGreaterThan(0);
    expect(char.examples.length).toBeGreaterThan(0);
  });

  it('prints the list kind and the non-word count in the summary', () => {
    const r = model('evaluate', '--train', bertram, '--test', test, '--predictor', 'char');
    expect(r.status).toBe(0);
    expect(r.stdout).toMatch(/character-only list/);
    expect(r.stdout).toMatch(/Offered non-words \(5 slots\): [1-9]\d* of \d+ slots/);
  });
});
