// `model bench [--json] [--vocabulary FILE.json]` (also `npm run bench`): speed, size, memory and
// quality figures of the engine on fixed slices of the Brown corpus. With --vocabulary the client's
// added and blocked words go into every word list it builds: the profile pipeline's (learned and
// applied as a version's training does), the demo version's file header and the test keyboard's
// list built from it (profileBlockParts), and the suggestions section's lists. Figures
// are printed, never asserted (targets are listed beside them). Seeded PRNG,
// warm-up, repetitions, min and mean ± std, and a sink so no work is
// optimised away.
import { spawnSync } from 'node:child_process';
import { readdirSync, readFileSync } from 'node:fs';
import { cpus, loadavg } from 'node:os';
import { join } from 'node:path';
import { gzipSync } from 'node:zlib';
import { joinDocuments, loadBrown } from '../brown';
import { loadBaseModel } from '../base-model';
import { baseWordsFile, loadBaseWords } from '../base-words';
import {
  BlendedModel,
  codeLengthBits,
  decodeText,
  deserializeModel,
  encodeText,
  PpmModel,
  prepareText,
  serializeModel,
} from '@keyloom/shared';
import type { NextSymbolModel, ScanStepsByLayout } from '@keyloom/shared';
import { simulateKeystrokes } from '@keyloom/shared';
import { seededRandom } from '@keyloom/shared/src/engine/seeded-random';
import {
  type ClientVocabulary,
  defaultProfileSettings,
  profileBlockParts,
  trainAndEvaluateProfile,
  writeProfileFile,
  type ProfileResult,
} from '@keyloom/shared';
import { nextLetterProbabilities, suggest } from '@keyloom/shared';
import { WordNgramModel, WordPredictor } from '@keyloom/shared';
import { builtInPracticePhrases } from '@keyloom/shared/src/trials/practice-phrases';
import { UsageError } from './cli-errors';
import { parseArgs } from './args';
import { vocabularyOption } from './vocabulary-file';
import { latencyFigures, measureSuggestions } from './bench-suggestions';
import { demoDir, tsxEnvironment, workspaceRoot } from '../paths';

const SETTINGS = { order: 5, escape: 'C' as const, exclusion: true, updateExclusion: true };
const TRAIN_CHARS = 1_000_000;
const TEST_CHARS = 100_000;
const REPS = 3;
const HELD_OUT = ['cp', 'cr'];

/** Throughput statistics over repetitions: characters per second. */
type Rate = { min: number; mean: number; std: number; reps: number };

let sink = 0;

function timeReps(reps: number, chars: number, run: () => number): Rate {
  const rates: number[] = [];
  for (let r = 0; r < reps; r++) {
    const start = performance.now();
    sink += run();
    rates.push(chars / ((performance.now() - start) / 1000));
  }
  const mean = rates.reduce((a, b) => a + b, 0) / rates.length;
  const std = Math.sqrt(rates.reduce((a, b) => a + (b - mean) ** 2, 0) / Math.max(1, rates.length - 1));
  return { min: Math.round(Math.min(...rates)), mean: Math.round(mean), std: Math.round(std), reps };
}

let peakSampledRss = 0;
function sampleRss(): void {
  peakSampledRss = Math.max(peakSampledRss, process.memoryUsage().rss);
}

const mb = (bytes: number): number => Math.round((bytes / 2 ** 20) * 10) / 10;

export async function runBench(args: string[]): Promise<void> {
  const parsed = parseArgs(args, {
    single: ['vocabulary'],
    flags: ['json', 'profile-only', 'keyboard-only', 'suggestions-only'],
  });
  if (parsed.positional.length > 0)
    throw new UsageError(`unexpected argument ${JSON.stringify(parsed.positional[0])}`);
  const vocabulary = vocabularyOption(parsed);
  const json = parsed.flags.has('json');
  const log = (msg: string): void => {
    if (!json) process.stderr.write(`bench: ${msg}\n`);
  };
  const timer = setInterval(sampleRss, 50);
  try {
    // --profile-only: just the profile pipeline section, word and character lists (under two minutes).
    // --keyboard-only: just the test keyboard section (about 20 s).
    // --suggestions-only: just the word and character lists side by side (about two minutes).
    const report = parsed.flags.has('profile-only')
      ? { profilePipeline: await measureProfile(log, vocabulary) }
      : parsed.flags.has('keyboard-only')
        ? { testKeyboard: await measureKeyboard(log, await demoProfiles(log, vocabulary), vocabulary) }
        : parsed.flags.has('suggestions-only')
          ? { suggestions: measureSuggestions(log, await demoProfiles(log, vocabulary), vocabulary) }
          : await measure(log, vocabulary);
    const { additions, blocks } = vocabulary;
    const out =
      additions.length + blocks.length > 0
        ? { ...report, vocabulary: { added: additions.length, blocked: blocks.length } }
        : report;
    if (json) process.stdout.write(`${JSON.stringify(out)}\n`);
    else process.stdout.write(`${JSON.stringify(out, null, 2)}\n`);
  } finally {
    clearInterval(timer);
  }
}

async function measure(
  log: (msg: string) => void,
  vocabulary: ClientVocabulary,
): Promise<Record<string, unknown>> {
  // Other work on this 2-core machine slows every wall-clock figure; report the load.
  const loadAtStart = loadavg()[0];
  const { documents } = loadBrown();
  const trainDocs = documents.filter((d) => !HELD_OUT.includes(d.section));
  const testDocs = documents.filter((d) => HELD_OUT.includes(d.section));
  const trainAll = prepareText(joinDocuments(trainDocs));
  const testAll = prepareText(joinDocuments(testDocs));
  const train = trainAll.subarray(0, TRAIN_CHARS);
  const test = testAll.subarray(0, TEST_CHARS);
  const rnd = seededRandom(20261201);

  // Warm-up: every code path once on small slices.
  log('warming up');
  {
    const m = PpmModel.train(train.subarray(0, 100_000), SETTINGS);
    const small = test.subarray(0, 5_000);
    sink += codeLengthBits(m.clone(), small);
    const bytes = encodeText(m.clone(), small);
    sink += decodeText(m.clone(), bytes, small.length).length;
    sink += simulateKeystrokes(m.clone().freeze(), small.subarray(0, 2_000)).keystrokes[1];
  }
  sampleRss();

  log('training orders 3, 5, 8');
  const training: Record<string, Rate> = {};
  for (const order of [3, 5, 8]) {
    training[`order${order}`] = timeReps(
      REPS,
      train.length,
      () => PpmModel.train(train, { ...SETTINGS, order }).contextCount,
    );
    sampleRss();
  }

  const model = PpmModel.train(train, SETTINGS);
  log('ideal code length, encode, decode');
  const ideal = timeReps(REPS, test.length, () => codeLengthBits(model.clone(), test, { adaptive: true }));
  let coded: Uint8Array = new Uint8Array(0);
  const encode = timeReps(REPS, test.length, () => {
    coded = encodeText(model.clone(), test);
    return coded.length;
  });
  let decoded: Uint32Array = new Uint32Array(0);
  const decode = timeReps(REPS, test.length, () => {
    decoded = decodeText(model.clone(), coded, test.length);
    return decoded.length;
  });
  const roundTrip = decoded.length === test.length && decoded.every((c, i) => c === test[i]);
  sampleRss();

  log('quality: train on 13 categories, test on cp + cr');
  const qualityStart = performance.now();
  const qualityModel = PpmModel.train(trainAll, SETTINGS);
  const qualityBits = codeLengthBits(qualityModel.clone(), testAll, { adaptive: true });
  const qualitySeconds = (performance.now() - qualityStart) / 1000;
  sampleRss();

  // Latency is measured twice at the same 1,000 seeded positions of the
  // held-out text: with the Brown base model (which has seen that text, so
  // its lists are unusually sure and quick) and with a model of the same size
  // trained without it (the realistic case; reported as p50/p95).
  log('suggestion latency (5 slots)');
  const positions: number[] = [];
  for (let i = 0; i < 1200; i++) positions.push(1 + Math.floor(rnd() * (testAll.length - 1)));
  // Right after a space the search is widest (the whole next word is open).
  const wordStarts: number[] = [];
  while (wordStarts.length < 1200) {
    const end = 1 + Math.floor(rnd() * (testAll.length - 1));
    if (testAll[end - 1] === 0x20) wordStarts.push(end);
  }
  const latency = (
    m: NextSymbolModel,
    at: readonly number[] = positions,
  ): { p50: number; p95: number; mean: number; calls: number } => {
    const times: number[] = [];
    at.forEach((end, i) => {
      const start = performance.now();
      sink += suggest(m, testAll, end, 5).length;
      if (i >= 200) times.push(performance.now() - start); // first 200 are warm-up
    });
    times.sort((x, y) => x - y);
    const pick = (q: number): number =>
      Math.round(times[Math.min(times.length - 1, Math.floor(q * times.length))] * 1000) / 1000;
    return {
      p50: pick(0.5),
      p95: pick(0.95),
      mean: Math.round((times.reduce((x, y) => x + y, 0) / times.length) * 1000) / 1000,
      calls: times.length,
    };
  };
  const heldOutModel = qualityModel.clone().freeze();
  const heldOutLatency = latency(heldOutModel);
  const wordStartLatency = latency(heldOutModel, wordStarts);
  const base = loadBaseModel();
  const baseLatency = latency(base);
  sampleRss();

  log('keystroke simulation, 100,000 characters, 1..10 slots');
  const ksStart = performance.now();
  const ksCpu = process.cpuUsage();
  const ks = simulateKeystrokes(model.clone(), test, { maxSlots: 10, adaptive: true });
  const ksSeconds = (performance.now() - ksStart) / 1000;
  const ksCpuSeconds = process.cpuUsage(ksCpu).user / 1e6;
  sampleRss();

  log('order-6 model of the whole corpus in a child process');
  const child = order6Child();

  // After the child: a forked child starts with the parent's resident pages
  // counted in its peak, so the profile run's memory must not be there yet.
  const profilePipeline = await measureProfile(log, vocabulary);
  sampleRss();
  const demo = await demoProfiles(log, vocabulary);
  const testKeyboard = await measureKeyboard(log, demo, vocabulary);
  const suggestions = measureSuggestions(log, demo, vocabulary);
  sampleRss();

  const bpc = qualityBits / testAll.length;
  return {
    machine: {
      node: process.version,
      cpus: cpus().length,
      cpu: cpus()[0]?.model ?? 'unknown',
      loadAverage1m: {
        atStart: Math.round(loadAtStart * 100) / 100,
        atEnd: Math.round(loadavg()[0] * 100) / 100,
      },
    },
    slice: {
      trainChars: train.length,
      testChars: test.length,
      settings: SETTINGS,
      heldOutSections: HELD_OUT,
      reps: REPS,
    },
    trainingCharsPerSecond: training,
    idealCodeLengthCharsPerSecond: ideal,
    encodeCharsPerSecond: encode,
    decodeCharsPerSecond: decode,
    coded: {
      bytes: coded.length,
      bpc: Math.round(((coded.length * 8) / test.length) * 1e4) / 1e4,
      roundTrip,
    },
    suggestionLatencyMs: {
      ...heldOutLatency,
      slots: 5,
      model: 'order 5 trained on the 13 other categories (5.5 M chars), contexts from held-out cp + cr',
      atWordStart: { ...wordStartLatency, model: 'same, only positions right after a space' },
      baseModel: { ...baseLatency, model: 'Brown base model (has seen these contexts)' },
    },
    keystrokeSimulation: {
      chars: test.length,
      seconds: Math.round(ksSeconds * 100) / 100,
      cpuSeconds: Math.round(ksCpuSeconds * 100) / 100,
      charsPerSecond: Math.round(test.length / ksSeconds),
      savings: Object.fromEntries(
        ks.savings.slice(1).map((s, i) => [String(i + 1), Math.round(s * 1e4) / 1e4]),
      ),
    },
    modelSize: {
      contexts: model.contextCount,
      bytes: model.byteSize,
      bytesPerContext: Math.round((model.byteSize / model.contextCount) * 10) / 10,
    },
    memory: {
      peakRssMb: mb(process.resourceUsage().maxRSS * 1024),
      peakSampledRssMb: mb(peakSampledRss),
      order6WholeBrown: child,
    },
    quality: {
      bpc: Math.round(bpc * 1e4) / 1e4,
      trainChars: trainAll.length,
      testChars: testAll.length,
      order: 5,
      escape: 'C',
      exclusion: true,
      adaptive: true,
      seconds: Math.round(qualitySeconds * 10) / 10,
    },
    profilePipeline,
    testKeyboard,
    suggestions,
    targets: {
      trainingOrder5AtLeast2MCharsPerSecond: training.order5.mean >= 2_000_000,
      encodeAtLeast1MCharsPerSecond: encode.mean >= 1_000_000,
      decodeAtLeast1MCharsPerSecond: decode.mean >= 1_000_000,
      order6WholeBrownAtMost200Mb: typeof child.peakRssMb === 'number' && child.peakRssMb <= 200,
      suggestionP95AtMost5Ms: heldOutLatency.p95 <= 5 && baseLatency.p95 <= 5 && wordStartLatency.p95 <= 5,
      keystrokeSimulation100kAtMost30s: ksSeconds <= 30,
      qualityAtMost2_10Bpc: bpc <= 2.1,
      profile200kAtMost60s: profilePipeline.seconds <= 60,
      keyboardEngineP95AtMost16Ms: testKeyboard.perKeyPressMs.p95 <= 16,
      keyboardWordListP95AtMost16Ms: testKeyboard.wordList.perKeyPressMs.p95 <= 16,
      versionFileWithWordsAtMost2x: testKeyboard.wordList.versionFileRatio <= 2,
      wordSuggestionP95AtMost5Ms: suggestions.latencyMs.p95 <= 5,
      wordListKs5AtLeastCharPlus0_03: suggestions.brownSplitA.staticNoBase.ks5WordMinusChar >= 0.03,
      wordListOffersNoNonWords:
        suggestions.brownSplitA.nonWordSlots.word.nonWordSlots === 0 &&
        suggestions.demoSamples.word.nonWordShare === 0,
    },
    sink: sink % 7,
  };
}

/** Builds an order-6 model of the whole Brown text in a fresh process; reports its peak RSS. */
function order6Child(): { peakRssMb: number | string; seconds?: number; contexts?: number } {
  const script = join(__dirname, 'bench-order6-child.ts');
  const run = spawnSync(process.execPath, ['--import', 'tsx', script], {
    encoding: 'utf8',
    cwd: workspaceRoot,
    env: tsxEnvironment(),
  });
  try {
    const out = JSON.parse(run.stdout.trim().split('\n').pop() ?? '') as {
      peakRssMb: number;
      seconds: number;
      contexts: number;
    };
    return out;
  } catch {
    return { peakRssMb: `child failed: ${(run.stderr || run.stdout).trim().split('\n')[0] ?? run.status}` };
  }
}

const PROFILE_CHARS = 200_000;
const PROFILE_CATEGORY = 'fiction';

/**
 * Trains and evaluates a profile version (engine/profile) on 200,000
 * characters of Brown fiction documents standing in for a client's samples,
 * with the Brown base model and vocabulary: order 5, method C, 5-fold, 1..10
 * slots, the default keystroke sample cap, the word-aware list (timed; target:
 * under a minute on this machine); then the same with the character-only list
 * for comparison (its keystroke savings and non-word share beside).
 */
async function measureProfile(
  log: (msg: string) => void,
  vocabulary: ClientVocabulary,
): Promise<{
  chars: number;
  documents: number;
  category: string;
  folds: number;
  ksSampleChars: number | null;
  ksChars: number;
  seconds: number;
  cpuSeconds: number;
  stagesMs: Record<string, number>;
  progressCalls: number;
  peakRssMbSoFar: number;
  bpcIdeal: number;
  keystrokeSavings5: number;
  /** Share of words offered before their last letter, and selections per word, at 5 slots. */
  hitRate5: number;
  selectionsPerWord5: number;
  nonWordShare: number;
  scanStepsByLayout: ScanStepsByLayout;
  charList: { keystrokeSavings5: number; nonWordShare: number; seconds: number };
  baseWeight: number;
  note: string;
}> {
  log(`profile pipeline: ${PROFILE_CHARS} characters of Brown ${PROFILE_CATEGORY}, 5 folds`);
  const docs: { id: string; text: string }[] = [];
  let chars = 0;
  for (const d of loadBrown().documents.filter((x) => x.category === PROFILE_CATEGORY)) {
    if (chars >= PROFILE_CHARS) break;
    const text = d.text.slice(0, PROFILE_CHARS - chars);
    docs.push({ id: d.id, text });
    chars += text.length;
  }
  const base = loadBaseModel();
  const baseWords = loadBaseWords();
  let progressCalls = 0;
  const start = performance.now();
  const cpu = process.cpuUsage();
  const { report } = await trainAndEvaluateProfile(
    { documents: docs, settings: defaultProfileSettings, base, baseWords, folds: 5, vocabulary },
    () => progressCalls++,
  );
  const seconds = (performance.now() - start) / 1000;
  const cpuSeconds = process.cpuUsage(cpu).user / 1e6;
  const stagesMs: Record<string, number> = { ...report.timings };
  delete stagesMs.total;
  log('profile pipeline: the same with the character-only list');
  const charStart = performance.now();
  const { report: charReport } = await trainAndEvaluateProfile({
    documents: docs,
    settings: defaultProfileSettings,
    base,
    baseWords,
    folds: 5,
    predictor: 'char',
  });
  const charSeconds = (performance.now() - charStart) / 1000;
  return {
    chars: report.chars,
    documents: report.documents,
    category: PROFILE_CATEGORY,
    folds: report.folds,
    ksSampleChars: report.ksSampleChars,
    ksChars: report.ksChars,
    seconds: Math.round(seconds * 10) / 10,
    cpuSeconds: Math.round(cpuSeconds * 10) / 10,
    stagesMs,
    progressCalls,
    // Whole process so far (corpus and base model loading included).
    peakRssMbSoFar: mb(process.resourceUsage().maxRSS * 1024),
    bpcIdeal: report.bpcIdeal,
    keystrokeSavings5: report.keystrokeSavings['5'],
    hitRate5: report.hitRate['5'],
    selectionsPerWord5: report.selectionsPerWord['5'],
    nonWordShare: report.nonWordSlots.share,
    scanStepsByLayout: report.scanStepsByLayout,
    charList: {
      keystrokeSavings5: charReport.keystrokeSavings['5'],
      nonWordShare: charReport.nonWordSlots.share,
      seconds: Math.round(charSeconds * 10) / 10,
    },
    baseWeight: report.baseWeight,
    note:
      'The base model was trained on all of Brown, these documents included, so the tuned weight of the base ' +
      'is near 1 here; the timing does not depend on it (both models are consulted at every step).',
  };
}

const percentile = (sorted: number[], q: number): number =>
  sorted.length === 0 ? 0 : sorted[Math.min(sorted.length - 1, Math.floor(q * sorted.length))];
const ms3 = (x: number): number => Math.round(x * 1000) / 1000;

/** Times `step` at every position of every built-in practice phrase, typed letter by letter (ms each). */
function timePerKeyPress(step: (cps: Uint32Array, end: number) => number): number[] {
  const times: number[] = [];
  for (const { text } of builtInPracticePhrases) {
    const cps = prepareText(text);
    for (let end = 0; end <= cps.length; end++) {
      const start = performance.now();
      sink += step(cps, end);
      times.push(performance.now() - start);
    }
  }
  return times;
}

/** The demo samples (corpora/demo) as profile documents. */
function demoDocuments(): { id: string; text: string }[] {
  return readdirSync(demoDir)
    .filter((name) => name.endsWith('.txt'))
    .map((name) => ({ id: name, text: readFileSync(join(demoDir, name), 'utf8') }));
}

/**
 * A version trained like the seeded one (the invented demo samples, default settings, the Brown
 * base model and vocabulary), once with the word-aware list and once with the character-only list.
 */
async function demoProfiles(
  log: (msg: string) => void,
  vocabulary: ClientVocabulary,
): Promise<{ word: ProfileResult; char: ProfileResult }> {
  log('demo samples: profile pipeline with the word and the character list');
  const documents = demoDocuments();
  const input = {
    documents,
    settings: defaultProfileSettings,
    base: loadBaseModel(),
    baseWords: loadBaseWords(),
    folds: 5,
  };
  return {
    word: await trainAndEvaluateProfile({ ...input, predictor: 'word', vocabulary }),
    char: await trainAndEvaluateProfile({ ...input, predictor: 'char' }),
  };
}

/**
 * What the test keyboard downloads and computes for the demo client (the demo version, word-aware
 * list): its model file with and without the word model, the base model and the base vocabulary as
 * raw and gzip -9 bytes (what the browser fetches), the time to load them, and the engine's work
 * per key press while typing Keyloom's practice phrases letter by letter: with the word-aware list
 * as the keyboard runs it (the client's word model from the version, the base vocabulary, the
 * blended character model, learning what is typed: 5 suggestions, next-letter probabilities for
 * key tinting, then learning the key), and, for comparison, the character-only list (static). The
 * browser test reports the end-to-end figure (key press to updated suggestion row).
 */
async function measureKeyboard(
  log: (msg: string) => void,
  demo: { word: ProfileResult; char: ProfileResult },
  vocabulary: ClientVocabulary,
): Promise<{
  sampleChars: number;
  versionFile: { bytes: number; gzipBytes: number };
  baseModel: { bytes: number; gzipBytes: number };
  loadMs: number;
  baseWeight: number;
  perKeyPressMs: { p50: number; p95: number; max: number; keyPresses: number };
  wordList: {
    versionFile: { bytes: number; gzipBytes: number };
    versionFileRatio: number;
    baseVocabulary: { bytes: number; gzipBytes: number };
    loadMs: number;
    wordWeights: ProfileResult['wordWeights'];
    perKeyPressMs: { p50: number; p95: number; max: number; keyPresses: number };
  };
  note: string;
}> {
  log('test keyboard: demo version sizes and engine time per key press');
  const { modelBytes, baseWeight, report, wordModelBytes, wordWeights } = demo.word;
  const header = {
    format: 'keyloom-profile' as const,
    client: { pseudonym: 'bench' },
    version: { id: 'bench', number: 1, status: 'trained' as const, note: null },
    settings: { ...defaultProfileSettings },
    baseWeight,
    baseModelSha256: null,
    engineVersion: String(report.engineVersion),
    metrics: {},
    samples: [],
    createdAt: new Date(0).toISOString(),
    trainedAt: null,
    approvedBy: null,
    approvedAt: null,
    exportedAt: new Date(0).toISOString(),
    exportedBy: 'bench',
  };
  const file = writeProfileFile(header, modelBytes);
  // The version's file carries the vocabulary in its header, as the API writes it; the keyboard
  // applies the header's blocks to the list it builds (profileBlockParts).
  const headerWithWords = {
    ...header,
    ...(wordWeights ? { wordWeights } : {}),
    ...(vocabulary.additions.length + vocabulary.blocks.length > 0 ? { vocabulary } : {}),
  };
  const fileWithWords = writeProfileFile(headerWithWords, modelBytes, undefined, wordModelBytes);
  const base = loadBaseModel();
  const baseBytes = serializeModel(base);
  const baseWordBytes = readFileSync(baseWordsFile());
  const t0 = performance.now();
  const model = new BlendedModel(
    deserializeModel(modelBytes).freeze(),
    deserializeModel(baseBytes).freeze(),
    baseWeight,
  );
  const loadMs = performance.now() - t0;
  const times = timePerKeyPress(
    (cps, end) =>
      suggest(model, cps, end, 5).length +
      nextLetterProbabilities(model, cps, end, { foldCase: true }).length,
  );
  times.sort((a, b) => a - b);

  // The word-aware list as the keyboard runs it (it learns what is typed).
  const t1 = performance.now();
  const baseWords = loadBaseWords();
  const personalChar = deserializeModel(modelBytes);
  personalChar.adaptive = true;
  const charModel = new BlendedModel(personalChar, deserializeModel(baseBytes).freeze(), baseWeight);
  const wordModel = wordModelBytes ? WordNgramModel.fromBytes(wordModelBytes) : null;
  if (wordModel) wordModel.adaptive = true;
  const list = new WordPredictor({
    personal: wordModel,
    base: baseWords,
    char: charModel,
    weights: wordWeights ?? { personal: 1, base: 0, lexicon: 0, cache: 0 },
    capitalize: !defaultProfileSettings.caseFold,
    adaptive: true,
    ...profileBlockParts(headerWithWords),
  });
  const wordLoadMs = performance.now() - t1;
  const wordTimes = timePerKeyPress((cps, end) => {
    const n =
      list.suggest(cps, end, 5).length +
      nextLetterProbabilities(charModel, cps, end, { foldCase: true }).length;
    if (end < cps.length) list.learn(cps, end);
    return n;
  });
  const wordLatency = latencyFigures(wordTimes);
  const gz = (bytes: Uint8Array): number => gzipSync(bytes, { level: 9 }).length;
  return {
    sampleChars: report.chars,
    versionFile: { bytes: file.length, gzipBytes: gz(file) },
    baseModel: { bytes: baseBytes.length, gzipBytes: gz(baseBytes) },
    loadMs: Math.round(loadMs),
    baseWeight,
    perKeyPressMs: {
      p50: ms3(percentile(times, 0.5)),
      p95: ms3(percentile(times, 0.95)),
      max: ms3(times[times.length - 1] ?? 0),
      keyPresses: times.length,
    },
    wordList: {
      versionFile: { bytes: fileWithWords.length, gzipBytes: gz(fileWithWords) },
      versionFileRatio: Math.round((fileWithWords.length / file.length) * 100) / 100,
      baseVocabulary: { bytes: baseWordBytes.length, gzipBytes: gz(baseWordBytes) },
      loadMs: Math.round(wordLoadMs),
      wordWeights,
      perKeyPressMs: {
        p50: wordLatency.p50,
        p95: wordLatency.p95,
        max: ms3(Math.max(...wordTimes)),
        keyPresses: wordTimes.length,
      },
    },
    note:
      'Node, engine only (no worker message, no rendering). The base model and the base vocabulary are ' +
      'downloaded once per browser and shared by every version; a version alone is the small file. ' +
      'perKeyPressMs is the character-only list (static); wordList.perKeyPressMs the word-aware list, learning.',
  };
}
