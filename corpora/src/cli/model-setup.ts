// Building what the evaluate and suggest commands run: a personal PPM model
// trained on --train files, optionally blended with a base model (Brown, or
// one trained on --base-corpus files), and the suggestion list on top of it:
// the word-aware list (default) or the character-only list (--predictor char), with the client's
// added and blocked words of --vocabulary FILE.json (word-aware list only).
import { loadBaseModel, trainBaseModelOn } from '../base-model';
import { buildBaseWords, loadBaseWords } from '../base-words';
import { type PpmModel, prepareText } from '@keyloom/shared';
import { freshModel, trainPersonalModel, tuneBaseWeightOnTail } from '@keyloom/shared';
import type { EscapeMethod, NextSymbolModel } from '@keyloom/shared';
import {
  additionSentences,
  blockPartsOf,
  type ClientVocabulary,
  CharListPredictor,
  effectiveWeights,
  trainWordModel,
  tuneWordWeightsOnTail,
  WordPredictor,
  type BaseWords,
  type ListPredictor,
  type WordNgramModel,
  type WordWeights,
} from '@keyloom/shared';
import { UsageError } from './cli-errors';
import { integerIn, numberIn, oneOf, onOff, optionValue, readTextFile, type ParsedArgs } from './args';
import { vocabularyOption } from './vocabulary-file';

/** Single-valued options shared by evaluate and suggest. */
export const modelOptionNames = [
  'order',
  'escape',
  'exclusion',
  'base',
  'base-weight',
  'predictor',
  'vocabulary',
] as const;
/** Options taking one or more files, shared by evaluate and suggest. */
export const modelFileOptionNames = ['train', 'base-corpus'] as const;

export type PredictorKind = 'word' | 'char';

export type ModelChoice = {
  order: number;
  escape: EscapeMethod;
  exclusion: boolean;
  /** 'corpus': the base character and word models are built from `baseCorpus`. */
  base: 'none' | 'brown' | 'corpus';
  /** 'auto' or λ in 0..1 (weight of the base model). */
  baseWeight: 'auto' | number;
  /** The suggestion list: word-aware (only vocabulary words) or character-only. */
  predictor: PredictorKind;
  /** --base-corpus files (empty unless base is 'corpus'). */
  baseCorpus: string[];
  /** --vocabulary: additions learned into the client's word model, blocks never offered. */
  vocabulary: ClientVocabulary;
};

/**
 * Reads and checks --order, --escape, --exclusion, --base, --base-corpus, --base-weight, --predictor
 * and --vocabulary.
 */
export function modelChoice(parsed: ParsedArgs): ModelChoice {
  const weight = optionValue(parsed, 'base-weight', 'auto');
  const baseCorpus = parsed.values.get('base-corpus') ?? [];
  const baseOption = optionValue(parsed, 'base');
  if (baseCorpus.length > 0 && baseOption !== undefined)
    throw new UsageError('give either --base or --base-corpus, not both (--base-corpus implies a base)');
  const predictor = oneOf('predictor', optionValue(parsed, 'predictor', 'word'), ['word', 'char'] as const);
  if (predictor === 'char' && optionValue(parsed, 'vocabulary') !== undefined)
    throw new UsageError('--vocabulary works with the word-aware list only, not with --predictor char');
  return {
    order: integerIn('order', optionValue(parsed, 'order', '5'), 0, 12),
    escape: oneOf('escape', optionValue(parsed, 'escape', 'C'), ['A', 'B', 'C', 'D'] as const),
    exclusion: onOff('exclusion', optionValue(parsed, 'exclusion', 'on')),
    base: baseCorpus.length > 0 ? 'corpus' : oneOf('base', baseOption ?? 'none', ['none', 'brown'] as const),
    baseWeight: weight === 'auto' ? 'auto' : numberIn('base-weight', weight, 0, 1),
    predictor,
    baseCorpus,
    vocabulary: vocabularyOption(parsed),
  };
}

/** Reads every --train file (text only) and prepares it (NFC, line endings). */
export function readTrainingTexts(parsed: ParsedArgs, required: boolean): Uint32Array[] {
  const files = parsed.values.get('train') ?? [];
  if (required && files.length === 0)
    throw new UsageError('missing --train <file>... (or use --base brown or --base-corpus <file>...)');
  return files.map((f) => prepareText(readTextFile(f)));
}

/** Reads every --base-corpus file (text only), prepared like training text. */
export function readBaseCorpus(choice: ModelChoice): Uint32Array[] {
  return choice.baseCorpus.map((f) => prepareText(readTextFile(f)));
}

/** The base models: character (frozen) and word (frozen), or none. */
export type BaseModels = { char: PpmModel; words: BaseWords } | null;

/**
 * The base for a choice: Brown's (cached), one trained on the given texts (the SUBTLEX-US word
 * list stays in its vocabulary), or none.
 */
export function baseModelsFor(choice: ModelChoice, baseTexts: readonly Uint32Array[]): BaseModels {
  if (choice.base === 'brown') return { char: loadBaseModel(), words: loadBaseWords() };
  if (choice.base === 'corpus')
    return { char: trainBaseModelOn(baseTexts), words: buildBaseWords(baseTexts) };
  return null;
}

/** A trained personal model plus, when asked, the base model and λ, and the list built on them. */
export type BuiltModel = {
  personal: PpmModel;
  base?: PpmModel;
  /** λ actually used (0 without a base model). */
  baseWeight: number;
  /** The client's word model (null for the character-only list, and without training text unless adaptive). */
  words: WordNgramModel | null;
  baseWords: BaseWords | null;
  /** The word mixture's weights (null for the character-only list). */
  wordWeights: WordWeights | null;
  /** A fresh model to run: clones the personal model, shares the frozen base. */
  fresh(adaptive: boolean): NextSymbolModel;
  /** A fresh suggestion list of the chosen kind on a fresh model (the word model copied too). */
  predictor(adaptive: boolean): ListPredictor;
  /** True for a word of the vocabulary: the training texts' words and the base vocabulary. */
  isWord(word: string): boolean;
};

/**
 * Trains the personal model on the training texts (each learned as its own
 * text, no context across files). With a base model and `auto`, λ is tuned
 * on the last 10% of the training text: a personal model trained on the
 * other 90% and the base model are mixed on it (Keyloom never tunes on the
 * test text). Without training text, `auto` means the base model alone.
 *
 * The word list: the client's word model (modified Kneser–Ney trigrams, Chen & Goodman 1998) of
 * the training texts, the base vocabulary, and the mixture's weights tuned on the same 10% tail
 * (`adaptive`: whether the list will learn, so the recency cache takes part); the blended
 * character model rescores it; capitals at sentence starts. The vocabulary's additions are learned
 * into the client's word model after the texts (as the profile pipeline does), and its blocked words
 * are never offered (a replacement in their place).
 */
export function buildModel(
  choice: ModelChoice,
  texts: readonly Uint32Array[],
  baseModels: BaseModels,
  adaptive = false,
): BuiltModel {
  const settings = {
    order: choice.order,
    escape: choice.escape,
    exclusion: choice.exclusion,
    adaptive: true,
  };
  const personal = trainPersonalModel(settings, texts);
  const base = baseModels?.char;
  let baseWeight = 0;
  if (base)
    baseWeight =
      choice.baseWeight === 'auto' ? tuneBaseWeightOnTail(settings, texts, base) : choice.baseWeight;
  const baseWords = baseModels?.words ?? null;
  const hasText = texts.some((t) => t.length > 0);
  const added = additionSentences(choice.vocabulary.additions, { caseFold: false });
  const blocks = blockPartsOf(choice.vocabulary.blocks, { caseFold: false });
  // A list that learns gets a word model even without training text (it starts empty); so does
  // one with added words.
  const allWords = hasText || adaptive || added.length > 0 ? trainWordModel(texts, added) : null;
  const fresh = (adaptive: boolean): NextSymbolModel => freshModel(personal, base, baseWeight, adaptive);
  const vocabulary =
    allWords || baseWords
      ? new WordPredictor({
          personal: allWords,
          base: baseWords,
          char: null,
          weights: { personal: 1, base: 1, lexicon: 1, cache: 0 },
          capitalize: true,
          adaptive: false,
        })
      : null;
  const isWord = (word: string): boolean => vocabulary?.inVocabulary(word) ?? false;
  if (choice.predictor === 'char') {
    return {
      personal,
      base,
      baseWeight,
      words: null,
      baseWords,
      wordWeights: null,
      fresh,
      predictor: (adaptive) => new CharListPredictor(fresh(adaptive), adaptive),
      isWord,
    };
  }
  if (!vocabulary)
    throw new UsageError('the word list needs training text or a base (--base brown or --base-corpus)');
  const wordWeights = effectiveWeights({
    personal: allWords,
    base: baseWords,
    adaptive,
    weights: tuneWordWeightsOnTail(texts, baseWords, adaptive),
  });
  return {
    personal,
    base,
    baseWeight,
    words: allWords,
    baseWords,
    wordWeights,
    fresh,
    predictor: (adaptive) =>
      new WordPredictor({
        personal: allWords ? allWords.clone() : null,
        base: baseWords,
        char: fresh(adaptive),
        weights: wordWeights,
        capitalize: true,
        adaptive,
        ...blocks,
      }),
    isWord,
  };
}

/**
 * What evaluate and suggest both do with their arguments: read the model options, the --train
 * files (required unless a base is given or `trainRequired`), the base, and build.
 */
export function buildFromArgs(
  parsed: ParsedArgs,
  options: { trainRequired: boolean; adaptive: boolean },
): { choice: ModelChoice; built: BuiltModel } {
  const choice = modelChoice(parsed);
  const texts = readTrainingTexts(parsed, options.trainRequired || choice.base === 'none');
  const base = baseModelsFor(choice, readBaseCorpus(choice));
  return { choice, built: buildModel(choice, texts, base, options.adaptive) };
}
