// @vitest-environment node
// Latency figures of the engine on a demo-sized model, printed, not asserted (speed is checked
// by figures, not timed tests). Skipped unless KEYLOOM_ENGINE_BENCH=1:
//   cd client && KEYLOOM_ENGINE_BENCH=1 npx vitest run src/features/keyboard/engine/engine-latency
// The model: the demo client's invented samples (corpora/demo/*.txt) as the personal model and
// word model, the Brown base model and the base vocabulary (corpora/.cache/base-model.bin and
// base-words.bin, `npm run corpora`), λ and the word weights tuned on the last 10%.
import {
  deserializeBaseWords,
  deserializeModel,
  prepareText,
  serializeModel,
  trainPersonalModel,
  trainWordModel,
  tuneBlendWeightOnTail,
  tuneWordWeightsOnTail,
  writeProfileFile,
} from '@keyloom/shared';
import { existsSync, readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { gzip9, sha256Hex, testModelSettings, testProfileHeader } from './testing/brown-models';
import { engineSuggest, loadEngine, warmUpEngine } from './engine-core';

const root = fileURLToPath(new URL('../../../../../', import.meta.url));
const demoDir = join(root, 'corpora', 'demo');
const baseFile = join(root, 'corpora', '.cache', 'base-model.bin');
const baseWordsFile = join(root, 'corpora', '.cache', 'base-words.bin');
const enabled =
  import.meta.env.KEYLOOM_ENGINE_BENCH === '1' && existsSync(baseFile) && existsSync(baseWordsFile);

const quantile = (sorted: number[], q: number) =>
  sorted[Math.min(sorted.length - 1, Math.floor(q * sorted.length))];
const summary = (times: number[]) => {
  const s = [...times].sort((a, b) => a - b);
  const f = (x: number) => x.toFixed(2);
  return `n ${s.length}, p50 ${f(quantile(s, 0.5))} ms, p95 ${f(quantile(s, 0.95))} ms, max ${f(s[s.length - 1])} ms`;
};

describe.skipIf(!enabled)('engine latency on a demo-sized model', () => {
  it('prints load time, sizes and ms per suggest', () => {
    const texts = readdirSync(demoDir)
      .filter((f) => f.endsWith('.txt'))
      .map((f) => prepareText(readFileSync(join(demoDir, f), 'utf8')));
    const baseBytes = new Uint8Array(readFileSync(baseFile));
    const base = deserializeModel(baseBytes).freeze();
    const personal = trainPersonalModel(testModelSettings, texts);
    const weight = tuneBlendWeightOnTail(testModelSettings, texts, base);
    const baseWordsBytes = new Uint8Array(readFileSync(baseWordsFile));
    const wordWeights = tuneWordWeightsOnTail(texts, deserializeBaseWords(baseWordsBytes), true);
    const profile = writeProfileFile(
      testProfileHeader({ blendWeight: weight, baseModelSha256: sha256Hex(baseBytes), wordWeights }),
      serializeModel(personal),
      undefined,
      trainWordModel(texts).toBytes(),
    );
    const chars = texts.reduce((n, t) => n + t.length, 0);
    console.log(`personal: ${chars} characters, λ ${weight.toFixed(3)}`);
    console.log(
      `profile ${profile.length} B (gzip -9 ${gzip9(profile).length} B); base ${baseBytes.length} B (gzip -9 ${gzip9(baseBytes).length} B); ` +
        `base vocabulary ${baseWordsBytes.length} B (gzip -9 ${gzip9(baseWordsBytes).length} B)`,
    );

    let t = performance.now();
    const engine = loadEngine(profile, baseBytes, baseWordsBytes);
    const loadMs = performance.now() - t;
    t = performance.now();
    warmUpEngine(engine);
    console.log(`load ${loadMs.toFixed(0)} ms, warm-up ${(performance.now() - t).toFixed(0)} ms`);

    const phrases = ['i would like a cup of tea please ', 'can we go sailing with pepper after lunch? '];
    const first: number[] = [];
    const later: number[] = [];
    for (let round = 0; round < 4; round++) {
      engine.cache.clear();
      for (const phrase of phrases) {
        for (let i = 1; i <= phrase.length; i++) {
          const s = performance.now();
          engineSuggest(engine, phrase.slice(0, i), 5);
          (round === 0 ? first : later).push(performance.now() - s);
        }
      }
    }
    console.log(`suggest, first pass after warm-up: ${summary(first)}`);
    console.log(`suggest, later passes: ${summary(later)}`);
    expect(first.length).toBeGreaterThan(0);
  }, 120_000);
});
