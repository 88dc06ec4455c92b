// k-fold cross-validation by document and a learning curve. Both are generic:
// the caller says how to train and how to evaluate, so they work for any
// model and any metric set (numbers only, so folds can be averaged).

/** Numeric metrics of one evaluation, e.g. { bpc: 2.1, ks5: 0.41 }. */
export type Metrics = Record<string, number>;

/** Mean and sample standard deviation of each metric over folds. */
export type MetricSummary = Record<string, { mean: number; std: number; min: number; max: number }>;

/**
 * Splits documents into k folds, round-robin in the given order (document d
 * goes to fold d mod k), so the split is deterministic and every fold gets a
 * spread of the list. Each fold is tested once, trained on the other k − 1.
 * @param k number of folds (2..documents.length)
 */
export function kFoldSplits<T>(documents: readonly T[], k: number): { train: T[]; test: T[] }[] {
  if (!Number.isInteger(k) || k < 2 || k > documents.length) {
    throw new RangeError(`k must be 2..${documents.length} (number of documents), got ${k}`);
  }
  const splits: { train: T[]; test: T[] }[] = [];
  for (let f = 0; f < k; f++) {
    splits.push({
      train: documents.filter((_, d) => d % k !== f),
      test: documents.filter((_, d) => d % k === f),
    });
  }
  return splits;
}

/** Runs `evaluate(train, test)` on every fold and summarises the metrics. */
export function crossValidate<T>(
  documents: readonly T[],
  k: number,
  evaluate: (train: T[], test: T[]) => Metrics,
): { folds: Metrics[]; summary: MetricSummary } {
  const folds = kFoldSplits(documents, k).map(({ train, test }) => evaluate(train, test));
  return { folds, summary: summarize(folds) };
}

/** Mean, sample std (n − 1), min and max of each metric present in every row. */
export function summarize(rows: readonly Metrics[]): MetricSummary {
  const out: MetricSummary = {};
  if (rows.length === 0) return out;
  for (const key of Object.keys(rows[0])) {
    const xs = rows.map((r) => r[key]).filter((x) => typeof x === 'number');
    if (xs.length !== rows.length) continue;
    const mean = xs.reduce((a, b) => a + b, 0) / xs.length;
    const variance = xs.length > 1 ? xs.reduce((a, b) => a + (b - mean) ** 2, 0) / (xs.length - 1) : 0;
    out[key] = { mean, std: Math.sqrt(variance), min: Math.min(...xs), max: Math.max(...xs) };
  }
  return out;
}

/** The standard points of Keyloom's learning curve. */
export const LEARNING_CURVE_FRACTIONS = [0.1, 0.25, 0.5, 1] as const;

/**
 * Metrics after training on growing leading parts of the training texts:
 * texts in order until the fraction of characters is reached, the last one
 * cut at a whitespace (so no word is split). Tells a clinician whether more
 * samples would still help.
 * @param fractions each in (0, 1]
 */
export function learningCurve(
  trainTexts: readonly string[],
  evaluate: (train: string[]) => Metrics,
  fractions: readonly number[] = LEARNING_CURVE_FRACTIONS,
): { fraction: number; trainChars: number; metrics: Metrics }[] {
  const total = trainTexts.reduce((n, t) => n + t.length, 0);
  return fractions.map((fraction) => {
    if (!(fraction > 0 && fraction <= 1)) throw new RangeError(`fraction must be in (0, 1], got ${fraction}`);
    const goal = Math.round(fraction * total);
    const part: string[] = [];
    let chars = 0;
    for (const text of trainTexts) {
      if (chars >= goal) break;
      if (chars + text.length <= goal) {
        part.push(text);
        chars += text.length;
        continue;
      }
      let cut = goal - chars;
      while (cut > 0 && !/\s/.test(text[cut])) cut--;
      if (cut === 0) cut = goal - chars; // one long word: cut where the goal is
      part.push(text.slice(0, cut));
      chars += cut;
    }
    return { fraction, trainChars: chars, metrics: evaluate(part) };
  });
}
