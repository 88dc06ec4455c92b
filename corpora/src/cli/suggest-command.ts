// `model suggest --train <file>... [--base none|brown | --base-corpus <file>...]
//   [--predictor word|char] --context "<text>" [--slots 5] [--json]`
// Prints the suggestion list for the end of the context: a JSON array of
// {"word", "p"} with --json. Without --train, a base (--base brown or
// --base-corpus) is required and is used alone. --predictor word (default)
// offers only words of the vocabulary (the training texts' words and the
// base's); char is the character-only list, kept for comparison.
import { prepareText } from '@keyloom/shared';
import { UsageError } from './cli-errors';
import { integerIn, optionValue, parseArgs } from './args';
import { buildFromArgs, modelFileOptionNames, modelOptionNames } from './model-setup';

export async function runSuggest(args: string[]): Promise<void> {
  const parsed = parseArgs(args, {
    single: ['context', 'slots', ...modelOptionNames],
    multi: modelFileOptionNames,
    flags: ['json'],
  });
  if (parsed.positional.length > 0)
    throw new UsageError(`unexpected argument ${JSON.stringify(parsed.positional[0])}`);
  const context = optionValue(parsed, 'context');
  if (context === undefined) throw new UsageError('missing --context "<text>"');
  const slots = integerIn('slots', optionValue(parsed, 'slots', '5'), 1, 100);
  const predictor = buildFromArgs(parsed, { trainRequired: false, adaptive: false }).built.predictor(false);
  const history = prepareText(context);
  const list = predictor.suggest(history, history.length, slots);
  if (parsed.flags.has('json')) {
    process.stdout.write(
      `${JSON.stringify(list.map((s) => ({ word: s.word, p: Number(s.p.toPrecision(6)) })))}\n`,
    );
    return;
  }
  if (list.length === 0) {
    process.stdout.write('No suggestions for this context.\n');
    return;
  }
  const width = Math.max(...list.map((s) => s.word.length));
  process.stdout.write(
    list
      .map((s, i) => `${String(i + 1).padStart(2)}. ${s.word.padEnd(width)}  ${(s.p * 100).toFixed(2)}%`)
      .join('\n') + '\n',
  );
}
