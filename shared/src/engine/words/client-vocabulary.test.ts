// Additions, blocks and replacements in the word list, and their place in the profile file. Small
// invented texts (Willowmere demo scenario, not from any corpus); the properties over Brown are in
// client-vocabulary-properties.test.ts.
import { describe, expect, it } from 'vitest';
import { PpmModel } from '../ppm-model';
import { serializeModel } from '../model-serialization';
import { prepareText } from '../text-preparation';
import {
  headerVocabulary,
  profileBlockParts,
  ProfileFileError,
  type ProfileFileHeader,
  readProfileFile,
  verifyProfileFile,
  writeProfileFile,
} from '../profile/profile-file';
import {
  additionSentences,
  blockPartsOf,
  checkClientVocabulary,
  DEFAULT_ADDITION_WEIGHT,
  VocabularyError,
} from './client-vocabulary';
import { WordPredictor, type WordPredictorParts } from './word-predictor';
import { trainWordModel } from './word-training';

const text =
  'We went to the harbour with Pepper. The harbour was busy and the boats were out. ' +
  'Then we went home for tea. The tea was hot. We talked about the harbour and the regatta. ' +
  'Pepper slept by the fire, and the damn dog snored all evening. Then the rain came.';

function list(over: Partial<WordPredictorParts> = {}, added: ReturnType<typeof additionSentences> = []) {
  return new WordPredictor({
    personal: trainWordModel([prepareText(text)], added),
    base: null,
    char: null,
    weights: { personal: 0.8, base: 0, lexicon: 0, cache: 0.2 },
    capitalize: true,
    adaptive: false,
    ...over,
  });
}

const words = (p: WordPredictor, typed: string, slots = 10): string[] => {
  const cps = prepareText(typed);
  return p.suggest(cps, cps.length, slots).map((s) => s.word);
};

describe('additions', () => {
  it('turns each addition into its words, once per unit of weight (default 3), as mid-sentence forms', () => {
    const s = additionSentences([{ text: 'Dr Okafor' }, { text: "St Anne's hospice", weight: 2 }], {
      caseFold: false,
    });
    expect(s).toHaveLength(DEFAULT_ADDITION_WEIGHT + 2);
    expect(s[0].map((t) => t.key)).toEqual(['dr', 'okafor']);
    expect(s[0].map((t) => t.form)).toEqual(['Dr', 'Okafor']);
    expect(s[0].every((t) => !t.sentenceStart)).toBe(true);
    expect(s[4].map((t) => t.key)).toEqual(['st', "anne's", 'hospice']);
    expect(additionSentences([{ text: 'Okafor' }], { caseFold: true })[0][0].form).toBe('okafor');
  });

  it('makes an added word a candidate after its first letter, and a phrase’s second word follow its first', () => {
    expect(words(list(), 'We saw Dr O')).not.toContain('Okafor');
    const p = list({}, additionSentences([{ text: 'Dr Okafor' }], { caseFold: false }));
    expect(words(p, 'We saw Dr O', 5)[0]).toBe('Okafor');
    expect(words(p, 'We saw Dr ', 3)).toContain('Okafor');
    // The word model counts it as written DEFAULT_ADDITION_WEIGHT times.
    expect(p.personal?.counts[p.personal.idOf('okafor')]).toBe(DEFAULT_ADDITION_WEIGHT);
  });

  it('refuses additions with no word, too many words or a bad weight, with a plain message', () => {
    const check = (text: string, weight?: number) => () =>
      checkClientVocabulary({ additions: [{ text, weight }], blocks: [] });
    expect(check('1234 ...')).toThrow(VocabularyError);
    expect(check('one two three four five six seven')).toThrow(/more than 6 words/);
    expect(check('Okafor', 0)).toThrow(/whole number 1\.\.100/);
    expect(check('Okafor', 2.5)).toThrow(/whole number/);
    expect(check('Okafor', 7)).not.toThrow();
  });
});

describe('blocks', () => {
  it('never offers a blocked word, from the client’s words or the cache, even after it is typed', () => {
    const open = list({ adaptive: true });
    expect(words(open, 'the d')).toContain('damn');
    const p = list({ adaptive: true, ...blockPartsOf([{ word: 'Damn' }], { caseFold: false }) });
    expect(words(p, 'the d')).not.toContain('damn');
    // Typed during a trial: it is learned (the model and the cache) but never offered back.
    const typed = prepareText('the damn thing. the damn rain. ');
    for (let i = 0; i < typed.length; i++) p.learn(typed, i);
    expect(p.cache.probability('damn')).toBeGreaterThan(0);
    const history = prepareText('the damn thing. the damn rain. the d');
    expect(p.suggest(history, history.length, 10).map((s) => s.word)).not.toContain('damn');
  });

  it('offers the replacement where the blocked word ranked, once', () => {
    const open = words(list(), 'the h', 5);
    const at = open.indexOf('harbour');
    expect(at).toBeGreaterThanOrEqual(0);
    const replaced = words(
      list(blockPartsOf([{ word: 'harbour', replacement: 'Quay' }], { caseFold: false })),
      'the h',
      5,
    );
    expect(replaced[at]).toBe('Quay');
    expect(replaced.filter((w) => w !== 'Quay')).toEqual(open.filter((w) => w !== 'harbour'));
    // A replacement already offered is not repeated: it stays at the better of the two places.
    const ten = words(list(), 'the h', 10);
    const [ia, ih] = [ten.indexOf('harbour'), ten.indexOf('home')];
    expect(ia).toBeGreaterThanOrEqual(0);
    expect(ih).toBeGreaterThan(ia);
    const dup = words(
      list(blockPartsOf([{ word: 'harbour', replacement: 'home' }], { caseFold: false })),
      'the h',
      10,
    );
    expect(dup.filter((w) => w === 'home')).toHaveLength(1);
    expect(dup.indexOf('home')).toBe(ia);
    expect(dup).not.toContain('harbour');
    // Case-folded profiles offer the replacement in lower case.
    expect(
      blockPartsOf([{ word: 'harbour', replacement: 'Quay' }], { caseFold: true }).replacements.get(
        'harbour',
      ),
    ).toBe('quay');
  });

  it('refuses a replacement that is blocked itself, or more than one word', () => {
    expect(() =>
      checkClientVocabulary({
        additions: [],
        blocks: [{ word: 'damn' }, { word: 'darn', replacement: 'damn' }],
      }),
    ).toThrow(/blocked itself/);
    expect(() => checkClientVocabulary({ additions: [], blocks: [{ word: 'two words' }] })).toThrow(
      /one word/,
    );
    expect(() =>
      checkClientVocabulary({ additions: [], blocks: [{ word: 'x', replacement: 'a b' }] }),
    ).toThrow(/one word/);
  });
});

describe('vocabulary in the profile file header (layouts 3 and 4)', () => {
  const header = (vocabulary?: unknown): ProfileFileHeader =>
    ({
      format: 'keyloom-profile',
      client: { pseudonym: 'R. Ashby' },
      version: { id: 'v', number: 1, status: 'trained', note: null },
      settings: { caseFold: false },
      blendWeight: 0,
      baseModelSha256: null,
      engineVersion: 'test',
      metrics: {},
      samples: [],
      createdAt: '2026-12-01T10:00:00.000Z',
      trainedAt: null,
      approvedBy: null,
      approvedAt: null,
      exportedAt: '2026-12-01T12:00:00.000Z',
      exportedBy: 'Clinician',
      ...(vocabulary === undefined ? {} : { vocabulary }),
    }) as ProfileFileHeader;
  const model = serializeModel(PpmModel.train(prepareText(text), { order: 3 }));
  const wordBytes = trainWordModel([prepareText(text)]).toBytes();
  const vocabulary = {
    additions: [{ text: 'Dr Okafor', weight: 4 }],
    blocks: [{ word: 'damn' }, { word: 'harbour', replacement: 'Quay' }],
  };

  it('carries additions and blocks, and the list built from the file applies the blocks', () => {
    const read = verifyProfileFile(writeProfileFile(header(vocabulary), model, undefined, wordBytes));
    expect(headerVocabulary(read.header)).toEqual(vocabulary);
    const parts = profileBlockParts(read.header);
    expect([...parts.blocked].sort()).toEqual(['damn', 'harbour']);
    expect(parts.replacements.get('harbour')).toBe('Quay');
    const p = list(parts);
    expect(words(p, 'the d')).not.toContain('damn');
    expect(words(p, 'the h', 5)).toContain('Quay');
    expect(words(p, 'the h', 5)).not.toContain('harbour');
  });

  it('reads an older file without the field as no additions and no blocks', () => {
    const read = readProfileFile(writeProfileFile(header(), model, undefined, wordBytes));
    expect(headerVocabulary(read.header)).toEqual({ additions: [], blocks: [] });
    expect(profileBlockParts(read.header).blocked.size).toBe(0);
  });

  it('refuses a header whose vocabulary is malformed, with a plain message', () => {
    for (const bad of [
      { additions: 'x', blocks: [] },
      { additions: [], blocks: [{ word: 3 }] },
      { additions: [], blocks: [{ word: 'a b' }] },
    ])
      expect(() => verifyProfileFile(writeProfileFile(header(bad), model, undefined, wordBytes))).toThrow(
        ProfileFileError,
      );
  });
});
