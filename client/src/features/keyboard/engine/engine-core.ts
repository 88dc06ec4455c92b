// The keyboard's model engine, free of React and of the worker: load a profile file (+ the
// base model) and answer suggestions. It runs inside engine.worker.ts in the browser and
// directly in node for the tests and the latency measurement.
import {
  BlendedModel,
  deserializeModel,
  nextLetterProbabilities,
  type NextSymbolModel,
  prepareText,
  type ProfileFileHeader,
  readProfileFile,
  suggest,
  suggestionContext,
} from '@keyloom/shared';

/** A loaded profile version, ready to answer. */
export type LoadedEngine = {
  model: NextSymbolModel;
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

/**
 * Loads a profile version as the profile pipeline uses it: the personal model blended with the
 * frozen base model at the header's λ (`new BlendedModel(personal, base, blendWeight)`), or the
 * personal model alone when the profile has no base model. Neither model learns while the
 * keyboard is used, so the same text always gets the same suggestions.
 * @param profile the uncompressed `.klprofile` bytes
 * @param base the uncompressed base model bytes (serializeModel layout), or null
 * @throws EngineLoadError with a readable message when a file is damaged or the base is missing
 */
export function loadEngine(profile: Uint8Array, base: Uint8Array | null): LoadedEngine {
  let file;
  try {
    file = readProfileFile(profile);
  } catch (error) {
    throw new EngineLoadError(`The profile version's model could not be read. ${messageOf(error)}`);
  }
  const { header } = file;
  let personal;
  try {
    personal = deserializeModel(file.model).freeze();
  } catch (error) {
    throw new EngineLoadError(`The model inside the profile file cannot be read: ${messageOf(error)}`);
  }
  let model: NextSymbolModel = personal;
  if (header.baseModelSha256) {
    if (!base) throw new EngineLoadError('This version was trained with a base model, but none was loaded.');
    let baseModel;
    try {
      baseModel = deserializeModel(base).freeze();
    } catch (error) {
      throw new EngineLoadError(`The base model cannot be read: ${messageOf(error)}`);
    }
    const weight = header.blendWeight;
    if (!(typeof weight === 'number' && weight >= 0 && weight <= 1)) {
      throw new EngineLoadError(`The profile file's blend weight must be 0..1, not ${String(weight)}.`);
    }
    model = new BlendedModel(personal, baseModel, weight);
  }
  const settings = typeof header.settings === 'object' && header.settings !== null ? header.settings : {};
  return {
    model,
    header,
    slots: slotsOf(settings),
    caseFold: settings.caseFold === true,
    order: model.order,
    contexts: personal.contextCount,
    cache: new Map(),
  };
}

/**
 * The history the model reads for `text`: the engine's own text preparation (line endings,
 * case folding when the profile was trained folded, NFC), as in training.
 */
export function historyOf(engine: Pick<LoadedEngine, 'caseFold'>, text: string): Uint32Array {
  return prepareText(text, { caseFold: engine.caseFold });
}

/**
 * Suggestions at the end of `text`: the `slots` words of the engine's `suggest` (completions of
 * the word being typed, or the next word after a boundary) and the probability of each next
 * letter (letters only, upper and lower case merged) for tinting keys. Words are asked for at
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
  const context = historyOf(engine, suggestionContext(text));
  const words = suggest(engine.model, context, context.length, slots).map((s) => s.word);
  const history = text === '' ? context : historyOf(engine, text);
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
