import { spawnSync } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';

// The command line is a contract (issue 3): spawn it exactly as users do.
const root = join(__dirname, '..', '..', '..');
const dir = mkdtempSync(join(tmpdir(), 'keyloom-cli-'));
const train = join(dir, 'train.txt');
const test = join(dir, 'test.txt');
const binary = join(dir, 'binary.dat');
const badUtf8 = join(dir, 'bad.txt');
const testText = 'Pepper and I took the boat out this morning. The wind was good.\n';

function model(...args: string[]): { status: number | null; stdout: string; stderr: string } {
  const run = spawnSync(process.execPath, ['--import', 'tsx', 'shared/src/cli/model.ts', ...args], {
    cwd: root,
    encoding: 'utf8',
    timeout: 120_000,
  });
  return { status: run.status, stdout: run.stdout, stderr: run.stderr };
}

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
      ].sort(),
    );
    expect(out.chars).toBe([...testText].length);
    expect(out.order).toBe(4);
    expect(out.escape).toBe('D');
    expect(out.roundTrip).toBe(true);
    expect(out.adaptive).toBe(true);
    expect(out.baseWeight).toBe(0);
    const ks = out.keystrokeSavings as Record<string, number>;
    const kspc = out.kspc as Record<string, number>;
    expect(Object.keys(ks)).toEqual(['1', '2', '3', '4', '5', '6', '7', '8', '9', '10']);
    for (let w = 1; w <= 10; w++) expect(ks[w] + kspc[w]).toBeCloseTo(1, 5);
    expect(ks['10']).toBeGreaterThan(0.3); // the test text repeats the training phrases
    expect(Object.keys(out.scanStepsPerChar as object).sort()).toEqual(['modelOrdered', 'rowColumn']);
    // Real coded stream: within a few bytes of the ideal length (WNC87 bound, REFERENCES §3).
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
