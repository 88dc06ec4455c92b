// `model suggest|evaluate|bench --vocabulary FILE.json`, spawned exactly as users run it (as in
// model-cli.test.ts): the client's blocked words are never offered, a block's replacement is
// offered in its place, added words are learned, and a file that cannot be used ends with exit
// code 2 and one line naming the file.
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { model } from './run-model';

const dir = mkdtempSync(join(tmpdir(), 'keyloom-cli-vocabulary-'));
const train = join(dir, 'train.txt');
const test = join(dir, 'test.txt');
const file = (name: string, content: string): string => {
  const path = join(dir, name);
  writeFileSync(path, content);
  return path;
};

// Invented demo text (the Willowmere demo scenario), not from any corpus: "Pepper" is its
// commonest word starting with P.
const LINES = [
  'Pepper and I went down to the harbour this morning.',
  'Pepper sat in the bow and barked at the gulls the whole way.',
  'Then Pepper slept by the piano while I played.',
  'My sister says Pepper is the best dog on the pier.',
];
// Prefixes of the blocked word after different contexts (each is one suggestion list).
const TEXTS = ['P', 'Pe', 'Pepp', 'Then P', 'and Pe', 'I saw Pep', 'the dog was Pe'];

type Offer = { word: string; p: number };
const listAt = (context: string, ...options: string[]): string[] => {
  const r = model('suggest', '--train', train, '--context', context, '--slots', '10', '--json', ...options);
  expect({ status: r.status, stderr: r.stderr }).toEqual({ status: 0, stderr: '' });
  return (JSON.parse(r.stdout) as Offer[]).map((s) => s.word);
};
const keys = (words: string[]): string[] => words.map((w) => w.toLowerCase());

let blockFile: string;
let replaceFile: string;

beforeAll(() => {
  writeFileSync(train, LINES.join('\n').repeat(10));
  writeFileSync(test, 'Pepper and I went to the pier. Pepper barked at the gulls.\n');
  blockFile = file('block.json', JSON.stringify({ additions: [], blocks: [{ word: 'pepper' }] }));
  replaceFile = file(
    'replace.json',
    JSON.stringify({ blocks: [{ word: 'Pepper', replacement: 'Biscuit' }], additions: [{ text: 'Okafor' }] }),
  );
});

describe('model suggest --vocabulary', () => {
  it('never offers a blocked word the list offers without the block', () => {
    let offeredPlain = 0;
    for (const text of TEXTS) {
      const plain = keys(listAt(text));
      if (plain.includes('pepper')) offeredPlain++;
      const blocked = keys(listAt(text, '--vocabulary', blockFile));
      expect({ text, offered: blocked.includes('pepper') }).toEqual({ text, offered: false });
    }
    // Without the block the word is offered at every one of these prefixes (the check can fail).
    expect(offeredPlain).toBe(TEXTS.length);
  }, 120_000);

  it('offers the replacement in the blocked word’s place, and learns an added word', () => {
    const plain = listAt('Then P');
    const replaced = listAt('Then P', '--vocabulary', replaceFile);
    expect(keys(plain)).toContain('pepper');
    expect(keys(plain)).not.toContain('biscuit');
    expect(keys(replaced)).not.toContain('pepper');
    // The replacement takes the blocked word's place (the first, here).
    expect(replaced.indexOf('Biscuit')).toBe(plain.findIndex((w) => w.toLowerCase() === 'pepper'));
    // "Okafor" is in no training text: offered only with the vocabulary file.
    expect(listAt('I saw Ok')).not.toContain('Okafor');
    expect(listAt('I saw Ok', '--vocabulary', replaceFile)).toContain('Okafor');
  }, 120_000);

  it('evaluate takes the file too, and refuses it with the character-only list', () => {
    const r = model('evaluate', '--train', train, '--test', test, '--vocabulary', blockFile, '--json');
    expect(r.status).toBe(0);
    expect((JSON.parse(r.stdout) as { predictor: string }).predictor).toBe('word');
    const c = model(
      'evaluate',
      '--train',
      train,
      '--test',
      test,
      '--vocabulary',
      blockFile,
      '--predictor',
      'char',
    );
    expect(c.status).toBe(2);
    expect(c.stderr.trim().split('\n')).toHaveLength(1);
    expect(c.stderr).toMatch(/--vocabulary.*--predictor char/);
  }, 120_000);
});

describe('a vocabulary file that cannot be used', () => {
  const cases: [string, string, RegExp][] = [
    ['not-json.json', '{"blocks": [', /is not JSON/],
    ['empty-word.json', '{"blocks":[{"word":""}]}', /blocks\.0\.word: Enter the word to block\./],
    ['not-a-list.json', '{"additions":"Okafor"}', /at additions: /],
    ['twice.json', '{"blocks":[{"word":"pier"},{"word":"Pier"}]}', /at blocks\.1\.word: .*already/],
    [
      'blocked-replacement.json',
      '{"blocks":[{"word":"pier","replacement":"harbour"},{"word":"harbour"}]}',
      /harbour/,
    ],
  ];
  it.each(cases)('%s: exit code 2 and one line naming the file', (name, content, message) => {
    const path = file(name, content);
    const r = model('suggest', '--train', train, '--context', 'P', '--vocabulary', path);
    expect(r.status).toBe(2);
    expect(r.stdout).toBe('');
    const lines = r.stderr.trim().split('\n');
    expect(lines).toHaveLength(1);
    expect(lines[0]).toContain(`--vocabulary ${path}`);
    expect(lines[0]).toMatch(message);
  });

  it('a missing file: exit code 2, one line (also for bench, before any measuring)', () => {
    const missing = join(dir, 'missing.json');
    for (const args of [
      ['suggest', '--train', train, '--context', 'P', '--vocabulary', missing],
      ['bench', '--keyboard-only', '--vocabulary', missing],
    ]) {
      const r = model(...args);
      expect(r.status).toBe(2);
      expect(r.stderr.trim().split('\n')).toEqual([`model: cannot read ${missing}: no such file`]);
    }
  });
});

describe('model --help', () => {
  it('lists the commands and the --vocabulary option, exit code 0', () => {
    const r = model('--help');
    expect(r.status).toBe(0);
    for (const word of ['evaluate', 'suggest', 'compress', 'decompress', 'bench', '--vocabulary'])
      expect(r.stdout).toContain(word);
  });
});
