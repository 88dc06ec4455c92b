// Building the word side of a profile from training texts: the client's word
// model, and the mixture's weights tuned on the training text's tail.
import { splitTail } from '../evaluation/held-out-evaluation';
import { componentProbabilities, fitMixtureWeights } from './mixture-weights';
import { WordNgramModel } from './word-ngram-model';
import type { BaseWords, WordWeights } from './word-predictor';
import { sentencesOf, type WordToken } from './word-tokens';

/**
 * The client's word model: every sentence of every text (redaction placeholders never become
 * words), then the `added` sentences (client-vocabulary.ts additionSentences).
 */
export function trainWordModel(
  texts: readonly Uint32Array[],
  added: readonly (readonly WordToken[])[] = [],
): WordNgramModel {
  const model = WordNgramModel.train([...texts.flatMap((t) => sentencesOf(t)), ...added]);
  model.adaptive = true;
  return model;
}

/**
 * The word mixture's weights, tuned on the last 10% of the training texts (never on test text): a
 * word model trained on the first 90%, the base vocabulary, and the cache when the list will learn
 * (`adaptive`).
 */
export function tuneWordWeightsOnTail(
  texts: readonly Uint32Array[],
  base: BaseWords | null,
  adaptive: boolean,
): WordWeights {
  const { head, tail } = splitTail(texts);
  const words = trainWordModel(head);
  const table = componentProbabilities({ personal: words, base, cache: adaptive }, tail);
  return fitMixtureWeights(table);
}
