// The hook end to end in jsdom: download (fetch stubbed with real gzip bytes from node:zlib),
// gunzip, load in the engine (on this thread: jsdom has no Worker; same protocol handler),
// suggestions equal to the shared WordPredictor over the same client words, base vocabulary and
// BlendedModel.
import { BlendedModel, prepareText, WordNgramModel, WordPredictor } from '@keyloom/shared';
import { act, renderHook, waitFor } from '@testing-library/react';
import { afterEach, beforeAll, describe, expect, it, vi } from 'vitest';
import { buildTestProfile, gzip9, sha256Hex } from './testing/brown-models';
import { clearModelDownloads } from './model-download';
import { useKeyboardEngine } from './use-keyboard-engine';

const V1 = '1c9e6a34-6b0f-4e34-9d0c-5a7b8c9d0e1f';
const V2 = '2d0f7b45-7c1a-4f45-8e1d-6b8c9d0e1f2a';

describe('useKeyboardEngine', () => {
  let built: ReturnType<typeof buildTestProfile>;
  let profileGz: Uint8Array;
  let baseGz: Uint8Array;
  let wordsGz: Uint8Array;
  let calls: string[];

  beforeAll(() => {
    built = buildTestProfile({
      personalIds: ['cn01', 'cn02'],
      baseIds: ['ca01', 'ca02', 'ca03'],
      baseWeight: 0.5,
      slots: 3,
    });
    profileGz = gzip9(built.profileBytes);
    baseGz = gzip9(built.baseBytes ?? new Uint8Array());
    wordsGz = gzip9(built.baseWordsBytes ?? new Uint8Array());
  });
  const wordsSha = () => sha256Hex(built.baseWordsBytes ?? new Uint8Array());

  afterEach(() => clearModelDownloads());

  const stubServer = (versionStatus: Record<string, number> = {}, plain = false) => {
    calls = [];
    const sha = built.header.baseModelSha256 ?? '';
    vi.stubGlobal(
      'fetch',
      vi.fn(async (input: RequestInfo | URL, init: RequestInit = {}) => {
        const path = String(input);
        calls.push(path);
        expect(init.credentials).toBe('same-origin');
        const version = /^\/api\/profile-versions\/([^/]+)\/model$/.exec(path);
        if (version) {
          const status = versionStatus[version[1]] ?? 200;
          if (status === 409) {
            const message = 'This version has no trained model yet.';
            return new Response(JSON.stringify({ statusCode: 409, message }), { status });
          }
          // `plain`: as if a proxy had sent it with Content-Encoding: gzip and the browser unpacked it.
          return new Response(plain ? built.profileBytes.slice() : profileGz.slice(), {
            status: 200,
            headers: { ETag: `"${sha256Hex(profileGz)}"`, 'X-Keyloom-Base-Words': wordsSha() },
          });
        }
        if (path === `/api/base-models/${sha}`) return new Response(baseGz.slice(), { status: 200 });
        if (path === `/api/base-words/${wordsSha()}`) return new Response(wordsGz.slice(), { status: 200 });
        return new Response(JSON.stringify({ statusCode: 404, message: 'Not found.' }), { status: 404 });
      }),
    );
  };

  it('downloads, loads and answers like the shared word list on the same models', async () => {
    stubServer();
    const { result } = renderHook(() => useKeyboardEngine(V1));
    expect(result.current.status).toBe('downloading');
    await waitFor(() => expect(result.current.status).toBe('ready'), { timeout: 10_000 });
    expect(calls).toEqual([
      `/api/profile-versions/${V1}/model`,
      `/api/base-models/${built.header.baseModelSha256}`,
      `/api/base-words/${wordsSha()}`,
    ]);
    expect(result.current.slots).toBe(3);
    expect(result.current.caseFold).toBe(false);
    expect(result.current.info).toMatchObject({
      versionBytes: built.profileBytes.length,
      versionCompressedBytes: profileGz.length,
      baseBytes: built.baseBytes?.length,
      baseCompressedBytes: baseGz.length,
      baseWordsBytes: built.baseWordsBytes?.length,
      baseWordsCompressedBytes: wordsGz.length,
      order: 5,
      contexts: built.personal.contextCount,
    });

    // Several requests at once: the newest is answered last and is what the hook shows.
    act(() => {
      result.current.request('t', 1);
      result.current.request('th', 2);
      result.current.request('the ', 3);
    });
    await waitFor(() => expect(result.current.suggestions?.seq).toBe(3));
    // The reference learns "the " as the adaptive engine does before answering.
    const personal = built.personal.clone();
    personal.adaptive = true;
    const list = new WordPredictor({
      personal: WordNgramModel.fromBytes(built.wordBytes ?? new Uint8Array()),
      base: built.baseWords,
      char: new BlendedModel(personal, built.base ?? built.personal, 0.5),
      weights: built.header.wordWeights ?? { personal: 0.5, base: 0.3, lexicon: 0.05, cache: 0.15 },
      capitalize: true,
      adaptive: true,
    });
    const history = prepareText('the ');
    for (let at = 0; at < history.length; at++) list.learn(history, at);
    expect(result.current.suggestions?.words).toEqual(
      list.suggest(history, history.length, 3).map((s) => s.word),
    );
    expect(result.current.suggestions?.text).toBe('the ');
  });

  it('keeps the downloads for the session: switching versions back and forth downloads each once', async () => {
    stubServer();
    const { result, rerender } = renderHook((props: { id: string | null }) => useKeyboardEngine(props.id), {
      initialProps: { id: V1 as string | null },
    });
    await waitFor(() => expect(result.current.status).toBe('ready'), { timeout: 10_000 });
    rerender({ id: V2 });
    expect(result.current.status).toBe('downloading');
    await waitFor(() => expect(result.current.status).toBe('ready'), { timeout: 10_000 });
    rerender({ id: V1 });
    await waitFor(() => expect(result.current.status).toBe('ready'), { timeout: 10_000 });
    // The network drops: the loaded engine keeps answering.
    vi.stubGlobal(
      'fetch',
      vi.fn(() => Promise.reject(new TypeError('Failed to fetch'))),
    );
    act(() => result.current.request('he was ', 7));
    await waitFor(() => expect(result.current.suggestions?.seq).toBe(7));
    expect(result.current.suggestions?.words.length).toBeGreaterThan(0);
    expect(calls.filter((c) => c.endsWith('/model'))).toEqual([
      `/api/profile-versions/${V1}/model`,
      `/api/profile-versions/${V2}/model`,
    ]);
    expect(calls.filter((c) => c.includes('/base-models/'))).toHaveLength(1);
    expect(calls.filter((c) => c.includes('/base-words/'))).toHaveLength(1);
    rerender({ id: null });
    expect(result.current.status).toBe('idle');
  });

  it("shows the API's message when the version has no model", async () => {
    stubServer({ [V2]: 409 });
    const { result } = renderHook(() => useKeyboardEngine(V2));
    await waitFor(() => expect(result.current.status).toBe('error'));
    expect(result.current.error).toBe('This version has no trained model yet.');
  });

  it('accepts a model the browser already unpacked (Content-Encoding: gzip on the way)', async () => {
    stubServer({}, true);
    const { result } = renderHook(() => useKeyboardEngine(V1));
    await waitFor(() => expect(result.current.status).toBe('ready'), { timeout: 10_000 });
    expect(result.current.info?.versionCompressedBytes).toBe(built.profileBytes.length);
  });
});
