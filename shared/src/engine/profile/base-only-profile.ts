// A base-only profile: general English alone, for a client with too little writing for a personal
// model. Nothing of the client's is trained: the character model is an empty personal model that
// the base outweighs completely (λ = 1), and the client's word model holds only the words the
// clinician added. On the device (and on the test keyboard) both learn what the client types, so
// the list starts as general English and the recency cache and the word model pick up the client's
// words as they are used.
import type { PpmSettings } from '../ppm-settings';
import { serializeModel } from '../model-serialization';
import { trainPersonalModel } from '../evaluation/held-out-evaluation';
import { DEFAULT_WORD_WEIGHTS } from '../words/mixture-weights';
import type { WordWeights } from '../words/word-predictor';
import { trainWordModel } from '../words/word-training';
import { additionSentences, checkClientVocabulary, VocabularyError } from '../words/client-vocabulary';
import { ProfileInputError } from './profile-errors';
import { checkProfileSettings, type ProfileSettings } from './profile-settings';

/** The base's weight in a base-only profile: general English alone. */
export const BASE_ONLY_WEIGHT = 1;

/** What a base-only profile stores: the models of a trained version, and no report. */
export type BaseOnlyProfile = {
  /** serializeModel of an empty personal model with the version's order, escape and exclusion. */
  modelBytes: Uint8Array;
  baseWeight: number;
  /** The client's word model holding only the added words (WordNgramModel bytes). */
  wordModelBytes: Uint8Array;
  /**
   * The word list's mixture weights. With no writing to tune them on, the engine's defaults
   * (DEFAULT_WORD_WEIGHTS, common practice, no source): the empty word model adds nothing until
   * the client types, so the list ranks by the base vocabulary, the recency cache and the
   * character model.
   */
  wordWeights: WordWeights;
};

/**
 * The models of a base-only version.
 * @throws ProfileInputError for settings or a vocabulary out of range
 */
export function buildBaseOnlyProfile(settings: ProfileSettings): BaseOnlyProfile {
  const checked = checkProfileSettings(settings);
  try {
    checkClientVocabulary(checked.vocabulary);
  } catch (error) {
    if (error instanceof VocabularyError) throw new ProfileInputError(error.message);
    throw error;
  }
  const ppm: Partial<PpmSettings> = {
    order: checked.order,
    escape: checked.escape,
    exclusion: checked.exclusion,
  };
  const added = additionSentences(checked.vocabulary.additions, { caseFold: checked.caseFold });
  return {
    modelBytes: serializeModel(trainPersonalModel(ppm, [])),
    baseWeight: BASE_ONLY_WEIGHT,
    wordModelBytes: trainWordModel([], added).toBytes(),
    wordWeights: { ...DEFAULT_WORD_WEIGHTS },
  };
}
