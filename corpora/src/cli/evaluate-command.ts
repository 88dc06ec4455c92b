// `model evaluate --train <file>... --test <file> [--order 5] [--escape A|B|C|D]
//   [--exclusion on|off] [--base none|brown | --base-corpus <file>...]
//   [--base-weight auto|<0..1>] [--predictor word|char] [--adaptive on|off] [--json]`
// Trains on the training files, then measures the test file: ideal and coded
// bits per character (the coded stream is decoded back and compared),
// keystroke savings and KSPC for 1..10 slots of the chosen list (word-aware
// by default, or the character-only list), scan steps per character, and how
// many offered slots are not words of the vocabulary (the training texts'
// words and the base's). Each measurement starts from its own copy of the
// trained models, so an adaptive run learns the test text once per
// measurement, as a device would.
import { prepareText } from '@keyloom/shared';
import { evaluateHeldOut, offeredNonWords, type OfferedWordsResult } from '@keyloom/shared';
import {
  type KeyboardLayout,
  keyboardLayoutLabels,
  keyboardLayouts,
  type WordWeights,
} from '@keyloom/shared';
import { UsageError } from './cli-errors';
import { onOff, optionValue, parseArgs, readTextFile } from './args';
import { buildFromArgs, modelFileOptionNames, modelOptionNames, type PredictorKind } from './model-setup';

/** The JSON the command prints (contract: keep these keys). */
export type EvaluateReport = {
  chars: number;
  order: number;
  escape: string;
  bpcIdeal: number;
  bpcCoded: number;
  codedBytes: number;
  roundTrip: boolean;
  keystrokeSavings: Record<string, number>;
  kspc: Record<string, number>;
  scanStepsPerChar: { rowColumn: number; modelOrdered: number };
  /** Row–column steps per character on each of the test keyboard's layouts (its own key rows). */
  scanStepsByLayout: Record<KeyboardLayout, number>;
  adaptive: boolean;
  baseWeight: number;
  predictor: PredictorKind;
  /** The word mixture's weights as used (null for the character-only list). */
  wordWeights: WordWeights | null;
  /** Offered slots that are not vocabulary words, on the lists of NON_WORD_SLOTS slots. */
  nonWordSlots: OfferedWordsResult;
  ms: number;
};

const SLOTS = 10;
/** List size the offered non-words are counted on (the test keyboard's row). */
const NON_WORD_SLOTS = 5;

export async function runEvaluate(args: string[]): Promise<void> {
  const parsed = parseArgs(args, {
    single: ['test', 'adaptive', ...modelOptionNames],
    multi: modelFileOptionNames,
    flags: ['json'],
  });
  if (parsed.positional.length > 0)
    throw new UsageError(`unexpected argument ${JSON.stringify(parsed.positional[0])}`);
  const testFile = optionValue(parsed, 'test');
  if (testFile === undefined) throw new UsageError('missing --test <file>');
  const adaptive = onOff('adaptive', optionValue(parsed, 'adaptive', 'on'));
  const start = performance.now();
  const test = prepareText(readTextFile(testFile));
  const { choice, built } = buildFromArgs(parsed, { trainRequired: true, adaptive });

  const measured = evaluateHeldOut((a) => built.fresh(a), test, {
    adaptive,
    maxSlots: SLOTS,
    predictor: built.predictor,
  });
  // A list that does not learn while it is read: what it offers stays within the vocabulary.
  const nonWordSlots = offeredNonWords(built.predictor(false), built.isWord, test, NON_WORD_SLOTS);
  const { bits, codedBytes, roundTrip, keystrokes: ks, scan } = measured;

  const perSlot = (values: number[]): Record<string, number> => {
    const out: Record<string, number> = {};
    for (let w = 1; w <= SLOTS; w++) out[String(w)] = round(values[w]);
    return out;
  };
  const n = test.length;
  const report: EvaluateReport = {
    chars: n,
    order: choice.order,
    escape: choice.escape,
    bpcIdeal: round(n === 0 ? 0 : bits / n),
    bpcCoded: round(n === 0 ? 0 : (codedBytes * 8) / n),
    codedBytes,
    roundTrip,
    keystrokeSavings: perSlot(ks.savings),
    kspc: perSlot(ks.kspc),
    scanStepsPerChar: { rowColumn: round(scan.rowColumn), modelOrdered: round(scan.modelOrdered) },
    scanStepsByLayout: {
      typewriter: round(scan.keyboardRowColumn.typewriter),
      alphabetical: round(scan.keyboardRowColumn.alphabetical),
      'model-ordered': round(scan.keyboardRowColumn['model-ordered']),
    },
    adaptive,
    baseWeight: round(built.baseWeight),
    predictor: choice.predictor,
    wordWeights: built.wordWeights,
    nonWordSlots,
    ms: Math.round(performance.now() - start),
  };
  if (parsed.flags.has('json')) {
    process.stdout.write(`${JSON.stringify(report)}\n`);
    return;
  }
  process.stdout.write(humanSummary(report, choice.base));
}

function round(x: number): number {
  return Math.round(x * 1e6) / 1e6;
}

function humanSummary(r: EvaluateReport, base: string): string {
  const pct = (x: number): string => `${(x * 100).toFixed(1)}%`;
  const lines = [
    `Test text: ${r.chars} characters; order ${r.order}, escape ${r.escape}, ${r.adaptive ? 'adaptive' : 'static'}` +
      (base === 'none' ? ', no base model' : `, base model weight ${r.baseWeight.toFixed(3)}`) +
      `, ${r.predictor === 'word' ? 'word-aware' : 'character-only'} list`,
    `Bits per character: ${r.bpcIdeal.toFixed(3)} ideal, ${r.bpcCoded.toFixed(3)} coded (${r.codedBytes} bytes; ` +
      `${r.roundTrip ? 'decodes back exactly' : 'DID NOT DECODE BACK'})`,
    r.wordWeights
      ? `Suggestions: vocabulary words only; mixture weights ${Object.entries(r.wordWeights)
          .map(([k, v]) => `${k} ${v.toFixed(3)}`)
          .join(', ')}`
      : 'Suggestions: character-only list (may offer parts of words)',
    `Offered non-words (${NON_WORD_SLOTS} slots): ${r.nonWordSlots.nonWordSlots} of ${r.nonWordSlots.slots} slots ` +
      `(${pct(r.nonWordSlots.nonWordShare)}) in ${r.nonWordSlots.lists} lists` +
      (r.nonWordSlots.examples.length > 0 ? `, e.g. ${r.nonWordSlots.examples.slice(0, 5).join(', ')}` : ''),
    'Slots  keystroke savings  keystrokes per character',
    ...Object.keys(r.keystrokeSavings).map(
      (w) =>
        `${w.padStart(5)}  ${pct(r.keystrokeSavings[w]).padStart(17)}  ${r.kspc[w].toFixed(3).padStart(24)}`,
    ),
    `Scan steps per character: ${r.scanStepsPerChar.rowColumn.toFixed(2)} row–column (fixed 6×7 grid), ` +
      `${r.scanStepsPerChar.modelOrdered.toFixed(2)} binary ordered by the model`,
    `Scan steps per character on the test keyboard (row–column, key rows only): ` +
      keyboardLayouts
        .map(
          (layout) =>
            `${r.scanStepsByLayout[layout].toFixed(2)} ${keyboardLayoutLabels[layout].toLowerCase()}`,
        )
        .join(', '),
    'Keystroke savings are not time savings: reading the list takes time too.',
    `(${r.ms} ms)`,
  ];
  return `${lines.join('\n')}\n`;
}
