// A trained version's results in the words a clinic uses (keystroke savings, keystrokes per
// character, selections per word, hit rate, words per minute, scan steps), one source for the
// version page, the printed report and the PDF, so every place says the same thing the same way.
// Compression terms (ideal and coded bits, folds, escape method) are not here: they are engine details.
import type { ProfileReport, RateReport } from '../schemas/profile-report.schema';

/** The figures, in the order they are shown. */
export const versionFigureKeys = [
  'slots',
  'keystrokeSavings',
  'kspc',
  'selectionsPerWord',
  'hitRate',
  'wpm',
  'rateChange',
  'scanSteps',
] as const;
export type VersionFigureKey = (typeof versionFigureKeys)[number];

/** One figure: its name, its value in words and numbers, and one plain line on what it means. */
export type VersionFigure = { key: VersionFigureKey; label: string; value: string; explanation: string };

const percentText = (fraction: number, digits = 1): string => `${(fraction * 100).toFixed(digits)}%`;
const at = (values: Record<string, number> | undefined, slots: number): number | null =>
  values?.[String(slots)] ?? null;

/**
 * The change the list makes to the estimated rate, in plain words: "About 2.9 more words a minute
 * than without suggestions (47% faster)." A rate that falls says why (reading the list costs time).
 */
export function rateChangeSentence(rates: Pick<RateReport, 'wpmWith' | 'wpmWithout'>): string {
  const change = rates.wpmWith - rates.wpmWithout;
  // A change under 0.05 words a minute rounds to nothing at one decimal.
  if (Math.abs(change) < 0.05)
    return 'No change in the estimate: the list saves about as much time as reading it costs.';
  const relative =
    rates.wpmWithout > 0
      ? ` (${Math.round((Math.abs(change) / rates.wpmWithout) * 100)}% ${change > 0 ? 'faster' : 'slower'})`
      : '';
  if (change > 0)
    return `About ${change.toFixed(1)} more words a minute than without suggestions${relative}.`;
  return `About ${(-change).toFixed(1)} fewer words a minute than without suggestions${relative}: reading the list costs more time than the keys it saves.`;
}

/**
 * The figures of a trained version's report at its own slot count. Figures an older report lacks
 * (selections per word, hit rate, scan steps by layout) are left out rather than shown as zero.
 */
export function versionFigures(report: ProfileReport): VersionFigure[] {
  const slots = report.rates.assumptions.slots;
  const figures: VersionFigure[] = [
    {
      key: 'slots',
      label: 'Suggestion slots',
      value: String(slots),
      explanation: 'Words the list offers at a time; every figure below assumes this many.',
    },
  ];
  const savings = at(report.keystrokeSavings, slots);
  if (savings !== null) {
    figures.push({
      key: 'keystrokeSavings',
      label: 'Keystroke savings',
      value: percentText(savings),
      explanation:
        'Share of key presses the list saves, against typing every letter, space and punctuation mark.',
    });
  }
  const kspc = at(report.kspc, slots);
  if (kspc !== null) {
    figures.push({
      key: 'kspc',
      label: 'Keystrokes per character (KSPC)',
      value: `${kspc.toFixed(2)} (1.00 without suggestions)`,
      explanation: 'Selections, keys and list choices together, per character of text written.',
    });
  }
  const perWord = at(report.selectionsPerWord, slots);
  if (perWord !== null && report.ksWords) {
    figures.push({
      key: 'selectionsPerWord',
      label: 'Selections per word',
      value: `${perWord.toFixed(1)} (${(report.ksChars / report.ksWords).toFixed(1)} without suggestions)`,
      explanation: 'Keys and list choices needed per word, its space and punctuation included.',
    });
  }
  const hit = at(report.hitRate, slots);
  if (hit !== null) {
    figures.push({
      key: 'hitRate',
      label: 'Hit rate',
      value: `${percentText(hit, 0)} of words`,
      explanation: 'How often the wanted word was in the list before its last letter was typed.',
    });
  }
  figures.push(
    {
      key: 'wpm',
      label: 'Estimated words per minute',
      value: `${report.rates.wpmWithout.toFixed(1)} without suggestions, ${report.rates.wpmWith.toFixed(1)} with ${slots}`,
      explanation: "An estimate from the client's access timing that counts the time to read the list.",
    },
    {
      key: 'rateChange',
      label: 'What the suggestions change',
      value: rateChangeSentence(report.rates),
      explanation:
        'Keystroke savings are not time savings: watch the client use the list before trusting a gain.',
    },
  );
  const scan = report.scanStepsByLayout;
  if (scan) {
    figures.push({
      key: 'scanSteps',
      label: 'Scan steps per character',
      value: `${scan.typewriter.toFixed(2)} (typewriter key order)`,
      explanation: 'Row–column scan steps a switch user waits through per character on the test keyboard.',
    });
  }
  return figures;
}
