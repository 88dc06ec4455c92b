// Building the model the evaluate and suggest commands run: a personal PPM
// model trained on --train files, optionally blended with the Brown base model.
import { loadBaseModel } from '../../../corpora/base-model';
import { type PpmModel, prepareText } from '../engine/index';
import { freshModel, trainPersonalModel, tuneBlendWeightOnTail } from '../engine/evaluation/index';
import type { EscapeMethod, NextSymbolModel } from '../engine/index';
import { UsageError } from './cli-errors';
import { integerIn, numberIn, oneOf, onOff, optionValue, readTextFile, type ParsedArgs } from './args';

/** Options shared by evaluate and suggest. */
export const modelOptionNames = ['order', 'escape', 'exclusion', 'base', 'base-weight'] as const;

export type ModelChoice = {
  order: number;
  escape: EscapeMethod;
  exclusion: boolean;
  base: 'none' | 'brown';
  /** 'auto' or λ in 0..1 (weight of the base model). */
  baseWeight: 'auto' | number;
};

/** Reads and checks --order, --escape, --exclusion, --base, --base-weight. */
export function modelChoice(parsed: ParsedArgs): ModelChoice {
  const weight = optionValue(parsed, 'base-weight', 'auto');
  return {
    order: integerIn('order', optionValue(parsed, 'order', '5'), 0, 12),
    escape: oneOf('escape', optionValue(parsed, 'escape', 'C'), ['A', 'B', 'C', 'D'] as const),
    exclusion: onOff('exclusion', optionValue(parsed, 'exclusion', 'on')),
    base: oneOf('base', optionValue(parsed, 'base', 'none'), ['none', 'brown'] as const),
    baseWeight: weight === 'auto' ? 'auto' : numberIn('base-weight', weight, 0, 1),
  };
}

/** Reads every --train file (text only) and prepares it (NFC, line endings). */
export function readTrainingTexts(parsed: ParsedArgs, required: boolean): Uint32Array[] {
  const files = parsed.values.get('train') ?? [];
  if (required && files.length === 0) throw new UsageError('missing --train <file>... (or use --base brown)');
  return files.map((f) => prepareText(readTextFile(f)));
}

/** A trained personal model plus, when asked, the base model and λ. */
export type BuiltModel = {
  personal: PpmModel;
  base?: PpmModel;
  /** λ actually used (0 without a base model). */
  baseWeight: number;
  /** A fresh model to run: clones the personal model, shares the frozen base. */
  fresh(adaptive: boolean): NextSymbolModel;
};

/**
 * Trains the personal model on the training texts (each learned as its own
 * text, no context across files). With the base model and `auto`, λ is tuned
 * on the last 10% of the training text: a personal model trained on the
 * other 90% and the base model are mixed on it (Keyloom never tunes on the
 * test text). Without training text, `auto` means the base model alone.
 */
export function buildModel(choice: ModelChoice, texts: readonly Uint32Array[]): BuiltModel {
  const settings = {
    order: choice.order,
    escape: choice.escape,
    exclusion: choice.exclusion,
    adaptive: true,
  };
  const personal = trainPersonalModel(settings, texts);
  let base: PpmModel | undefined;
  let weight = 0;
  if (choice.base === 'brown') {
    base = loadBaseModel();
    weight = choice.baseWeight === 'auto' ? tuneBlendWeightOnTail(settings, texts, base) : choice.baseWeight;
  }
  return {
    personal,
    base,
    baseWeight: weight,
    fresh(adaptive: boolean): NextSymbolModel {
      return freshModel(personal, base, weight, adaptive);
    },
  };
}
