// The character-only list (search/suggest.ts) behind the ListPredictor
// contract, kept for comparison (`--predictor char`) and for the bench.
import type { NextSymbolModel } from '../model-types';
import { DistributionMemo } from '../evaluation/distribution-memo';
import { completionRank, suggest, type SuggestOptions } from '../search/suggest';
import type { ListPredictor, WordSuggestion } from './word-predictor';

export class CharListPredictor implements ListPredictor {
  private readonly model: NextSymbolModel;

  /**
   * @param adaptive learn what is typed; a static model's distributions are memoised instead
   *   (the same context gives the same list every time)
   */
  constructor(
    model: NextSymbolModel,
    readonly adaptive: boolean,
    private readonly options: SuggestOptions = {},
  ) {
    this.model = adaptive ? model : new DistributionMemo(model);
  }

  suggest(history: ArrayLike<number>, end: number, slots: number): WordSuggestion[] {
    return suggest(this.model, history, end, slots, this.options);
  }

  completionRank(
    history: ArrayLike<number>,
    end: number,
    target: ArrayLike<number>,
    maxRank: number,
  ): number {
    return completionRank(this.model, history, end, target, maxRank, this.options);
  }

  learn(history: ArrayLike<number>, end: number): void {
    if (this.adaptive) this.model.learn(history, end);
  }
}
