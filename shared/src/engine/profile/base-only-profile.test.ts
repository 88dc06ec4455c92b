import { describe, expect, it } from 'vitest';
import { deserializeModel } from '../model-serialization';
import { WordNgramModel } from '../words/word-ngram-model';
import { BASE_ONLY_WEIGHT, buildBaseOnlyProfile } from './base-only-profile';
import { ProfileInputError } from './profile-errors';
import { defaultProfileSettings } from './profile-settings';

// The base-only models are empty by construction; their predictions equal the base model's is
// checked against the Brown corpus model in the API's HTTP tests (version-corrections).
describe('buildBaseOnlyProfile', () => {
  it('an empty personal model with the version’s settings, the base at full weight', () => {
    const profile = buildBaseOnlyProfile({ ...defaultProfileSettings, order: 3, escape: 'D' });
    expect(profile.baseWeight).toBe(BASE_ONLY_WEIGHT);
    const model = deserializeModel(profile.modelBytes);
    expect(model.settings).toMatchObject({ order: 3, escape: 'D' });
    expect(model.contextCount).toBeLessThanOrEqual(1);
    expect(WordNgramModel.fromBytes(profile.wordModelBytes).vocabularySize).toBe(0);
    const weights = Object.values(profile.wordWeights);
    expect(weights.every((w) => w >= 0 && w <= 1)).toBe(true);
  });

  it('the word model holds the clinician’s added words, and nothing else', () => {
    const profile = buildBaseOnlyProfile({
      ...defaultProfileSettings,
      caseFold: true,
      vocabulary: { additions: [{ text: 'Pepper' }, { text: 'spinnaker pole' }], blocks: [] },
    });
    const words = WordNgramModel.fromBytes(profile.wordModelBytes);
    expect(['pepper', 'spinnaker', 'pole'].every((w) => words.has(w))).toBe(true);
    expect(words.vocabularySize).toBe(3);
  });

  it('settings out of range: ProfileInputError', () => {
    expect(() => buildBaseOnlyProfile({ ...defaultProfileSettings, order: 40 })).toThrow(ProfileInputError);
  });
});
