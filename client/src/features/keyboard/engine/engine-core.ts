// The keyboard's model engine, free of React and of the worker: load a profile file (+ the
// base model and the base vocabulary) and answer suggestions. It runs inside engine.worker.ts in
// the browser and directly in node for the tests and the latency measurement.
import {
  type BaseWords,
  BlendedModel,
  type BlockParts,
  DEFAULT_WORD_WEIGHTS,
  deserializeBaseWords,
  deserializeModel,
  nextLetterProbabilities,
  type NextSymbolModel,
  partialWord,
  type PpmModel,
  prepareText,
  profileBlockParts,
  type ProfileFileHeader,
  readProfileFile,
  suggestionContext,
  WordNgramModel,
  WordPredictor,
  type WordWeights,
} from '@keyloom/shared';

/** A loaded profile version, ready to answer. */
export type LoadedEngine = {
  /** The character model: the personal model (learning when adaptive) blended with the frozen base. */
  model: NextSymbolModel;
  /**
   * The suggestion row: the word-aware list over the client's words (the file's word model), the
   * base vocabulary and the recency cache, combined with `model`. It learns what is typed.
   */
  predictor: WordPredictor;
  header: ProfileFileHeader;
  /** Suggestion slots from the header's settings (1..10; 5 when the header does not say). */
  slots: number;
  /** Whether the profile was trained on lower-cased text (the history is lower-cased too). */
  caseFold: boolean;
  /** Context order of the model used (the blend's: the larger of personal and base). */
  order: number;
  /** Context nodes of the personal model. */
  contexts: number;
  /** Answers by text and slots, most recent last (a small cache: typing back and forth repeats texts). */
  cache: Map<string, EngineAnswer>;
  /** The personal model's bytes as trained, to start again from them (resetEngineLearning). */
  personalBytes: Uint8Array;
  /** The frozen base model and its weight, or null without a base. */
  base: { model: PpmModel; baseWeight: number } | null;
  /** The client's word model bytes as trained (layouts 3 and 4), null in older files. */
  wordBytes: Uint8Array | null;
  /** The frozen base vocabulary, or null when none was loaded. */
  baseWords: BaseWords | null;
  /** The word mixture's weights: the header's, else DEFAULT_WORD_WEIGHTS. */
  wordWeights: WordWeights;
  /**
   * The header's blocked words and their replacements (profileBlockParts; none in older files):
   * a blocked word is never offered, also after it is typed during a trial.
   */
  blocks: BlockParts;
  /** The text whose finished words the personal model has learned since loading or the last reset. */
  learnedText: string;
};

/** Words for the suggestion row and next-letter probabilities for tinting keys. */
export type EngineAnswer = { words: string[]; letters: { char: string; p: number }[] };

/** A profile or base model the engine cannot use; the message is for a person. */
export class EngineLoadError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'EngineLoadError';
  }
}

const CACHE_LIMIT = 256;
const DEFAULT_SLOTS = 5;
const LETTER = /^\p{L}$/u;

const messageOf = (error: unknown): string => (error instanceof Error ? error.message : String(error));

function slotsOf(settings: Record<string, unknown>): number {
  const s = settings.slots;
  return typeof s === 'number' && Number.isInteger(s) && s >= 1 && s <= 10 ? s : DEFAULT_SLOTS;
}

function isWordWeights(value: unknown): value is WordWeights {
  if (typeof value !== 'object' || value === null) return false;
  const w = value as Record<string, unknown>;
  return (['personal', 'base', 'lexicon', 'cache'] as const).every(
    (k) => typeof w[k] === 'number' && Number.isFinite(w[k]) && w[k] >= 0 && w[k] <= 1,
  );
}

/**
 * Loads a profile version as the profile pipeline uses it: the personal model blended with the
 * frozen base model at the header's λ (`new BlendedModel(personal, base, baseWeight)`), or the
 * personal model alone when the profile has no base model; and the word-aware list over the
 * file's word model (none in files made before it: then only the base vocabulary's words are
 * offered), the base vocabulary and that character model. The bases never learn; the personal
 * models learn only through engineLearn (the worker calls it when asked to adapt).
 * @param profile the uncompressed `.klprofile` bytes
 * @param baseBytes the uncompressed base model bytes (serializeModel layout), or null
 * @param baseWordsBytes the uncompressed base vocabulary (serializeBaseWords layout), or null
 * @throws EngineLoadError with a readable message when a file is damaged or the base is missing
 */
export function loadEngine(
  profile: Uint8Array,
  baseBytes: Uint8Array | null,
  baseWordsBytes: Uint8Array | null = null,
): LoadedEngine {
  let file;
  try {
    file = readProfileFile(profile);
  } catch (error) {
    throw new EngineLoadError(`The profile version's model could not be read. ${messageOf(error)}`);
  }
  const { header } = file;
  let personal;
  try {
    personal = deserializeModel(file.model);
  } catch (error) {
    throw new EngineLoadError(`The model inside the profile file cannot be read: ${messageOf(error)}`);
  }
  // The personal model learns what is typed (engineLearn); the base never does.
  personal.adaptive = true;
  let base: LoadedEngine['base'] = null;
  if (header.baseModelSha256) {
    if (!baseBytes)
      throw new EngineLoadError('This version was trained with a base model, but none was loaded.');
    let baseModel;
    try {
      baseModel = deserializeModel(baseBytes).freeze();
    } catch (error) {
      throw new EngineLoadError(`The base model cannot be read: ${messageOf(error)}`);
    }
    const baseWeight = header.baseWeight;
    if (!(typeof baseWeight === 'number' && baseWeight >= 0 && baseWeight <= 1)) {
      throw new EngineLoadError(`The profile file's blend weight must be 0..1, not ${String(baseWeight)}.`);
    }
    base = { model: baseModel, baseWeight };
  }
  let baseWords: BaseWords | null = null;
  if (baseWordsBytes) {
    try {
      baseWords = deserializeBaseWords(baseWordsBytes);
    } catch (error) {
      throw new EngineLoadError(`The base vocabulary cannot be read: ${messageOf(error)}`);
    }
  }
  const wordWeights = header.wordWeights === undefined ? DEFAULT_WORD_WEIGHTS : header.wordWeights;
  if (!isWordWeights(wordWeights)) {
    throw new EngineLoadError('The profile file’s word weights must be four numbers 0..1.');
  }
  const settings = typeof header.settings === 'object' && header.settings !== null ? header.settings : {};
  const caseFold = settings.caseFold === true;
  let blocks: BlockParts;
  try {
    blocks = profileBlockParts(header);
  } catch (error) {
    throw new EngineLoadError(`The profile file’s blocked words cannot be used. ${messageOf(error)}`);
  }
  const parts = { wordBytes: file.words, baseWords, wordWeights, caseFold, blocks };
  let models;
  try {
    models = engineModels(personal, base, parts);
  } catch (error) {
    throw new EngineLoadError(`The word model inside the profile file cannot be read: ${messageOf(error)}`);
  }
  return {
    ...models,
    header,
    slots: slotsOf(settings),
    order: models.model.order,
    contexts: personal.contextCount,
    cache: new Map(),
    personalBytes: file.model,
    base,
    ...parts,
    learnedText: '',
  };
}

/**
 * The character model (the personal model blended with the base at its weight, or alone without
 * a base) and the word-aware list over it: a fresh copy of the client's word model from its
 * bytes (it learns; null without one), adaptive, capitalising unless the profile is case-folded,
 * never offering a blocked word (its replacement, if any, in its place).
 */
function engineModels(
  personal: PpmModel,
  base: LoadedEngine['base'],
  o: Pick<LoadedEngine, 'wordBytes' | 'baseWords' | 'wordWeights' | 'caseFold' | 'blocks'>,
): Pick<LoadedEngine, 'model' | 'predictor'> {
  const model = base ? new BlendedModel(personal, base.model, base.baseWeight) : personal;
  const words = o.wordBytes ? WordNgramModel.fromBytes(o.wordBytes) : null;
  if (words) words.adaptive = true;
  const predictor = new WordPredictor({
    personal: words,
    base: o.baseWords,
    char: model,
    weights: o.wordWeights,
    capitalize: !o.caseFold,
    adaptive: true,
    ...o.blocks,
  });
  return { model, predictor };
}

/**
 * Lets the personal models learn the words finished in `text` since they last learned, as the
 * client's device does and as the profile's keystroke simulation does (adaptive, a word's letters
 * learned once the word is finished, with the boundary after it): each new position goes to the
 * list's `learn`, which teaches the character model and, at a word's end, the client's word model
 * and the recency cache. Only what is new is learned: text
 * deleted after it was learned stays learned (counts are never taken back), and the learning
 * goes on from where the two texts agree. Clears the answer cache when anything was learned.
 */
export function engineLearn(engine: LoadedEngine, text: string): void {
  const finished = text.slice(0, text.length - partialWord(text).length);
  // Most key presses finish no word: nothing to prepare or learn.
  if (finished === engine.learnedText) return;
  let agree = 0;
  const known = engine.learnedText;
  while (agree < known.length && agree < finished.length && known[agree] === finished[agree]) agree++;
  const from = historyOf(engine, finished.slice(0, agree)).length;
  const history = historyOf(engine, finished);
  for (let at = from; at < history.length; at++) engine.predictor.learn(history, at);
  if (history.length > from) engine.cache.clear();
  engine.learnedText = finished;
}

/** Starts again from the version as trained (characters and words): what was learned since loading is forgotten. */
export function resetEngineLearning(engine: LoadedEngine): void {
  const personal = deserializeModel(engine.personalBytes);
  personal.adaptive = true;
  Object.assign(engine, engineModels(personal, engine.base, engine));
  engine.cache.clear();
  engine.learnedText = '';
}

/**
 * The history the model reads for `text`: the engine's own text preparation (line endings,
 * case folding when the profile was trained folded, NFC), as in training.
 */
export function historyOf(engine: Pick<LoadedEngine, 'caseFold'>, text: string): Uint32Array {
  return prepareText(text, { caseFold: engine.caseFold });
}

/**
 * Suggestions at the end of `text`: the `slots` words of the word-aware list (completions of the
 * word being typed, or the next word after a boundary; only words of the vocabulary) and the
 * character model's probability of each next letter (letters only, upper and lower case merged)
 * for tinting keys. Words are asked for at
 * `suggestionContext(text)` (a new message reads as a line start; after sentence punctuation the
 * space that picking a word adds is assumed), the letters at the text as it is.
 * @param slots list length, 1..10
 */
export function engineSuggest(engine: LoadedEngine, text: string, slots: number): EngineAnswer {
  const key = `${slots}\u0000${text}`;
  const cached = engine.cache.get(key);
  if (cached) {
    // Refresh its place so the most used answers stay.
    engine.cache.delete(key);
    engine.cache.set(key, cached);
    return cached;
  }
  const contextText = suggestionContext(text);
  const context = historyOf(engine, contextText);
  const words = engine.predictor.suggest(context, context.length, slots).map((s) => s.word);
  const history = text === '' || contextText === text ? context : historyOf(engine, text);
  const letters = nextLetterProbabilities(engine.model, history, history.length, { foldCase: true }).filter(
    (l) => LETTER.test(l.char),
  );
  const answer = { words, letters };
  engine.cache.set(key, answer);
  if (engine.cache.size > CACHE_LIMIT) {
    const oldest = engine.cache.keys().next().value;
    if (oldest !== undefined) engine.cache.delete(oldest);
  }
  return answer;
}

// Everyday openings typed once after loading, so the search code is compiled before the first
// real key press (the first answers are several times slower otherwise).
const WARM_UP_TEXTS = ['', 't', 'th', 'the ', 'i would like ', 'can you ', 'it is a', 'what time is it? '];

/**
 * Runs a few suggestions so the first key presses are answered at full speed; the answers are
 * not kept. @param rounds passes over the warm-up texts (1..10)
 */
export function warmUpEngine(engine: LoadedEngine, rounds = 10): void {
  for (let r = 0; r < rounds; r++) {
    for (const text of WARM_UP_TEXTS) engineSuggest(engine, text, engine.slots);
    engine.cache.clear();
  }
}
