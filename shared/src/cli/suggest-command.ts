// `model suggest --train <file>... [--base none|brown] --context "<text>"
//   [--slots 5] [--json]`
// Prints the suggestion list for the end of the context: a JSON array of
// {"word", "p"} with --json. Without --train, --base brown is required and
// the base model is used alone.
import { prepareText } from '../engine/index';
import { suggest } from '../engine/search/index';
import { UsageError } from './cli-errors';
import { integerIn, optionValue, parseArgs } from './args';
import { buildModel, modelChoice, modelOptionNames, readTrainingTexts } from './model-setup';

export async function runSuggest(args: string[]): Promise<void> {
  const parsed = parseArgs(args, {
    single: ['context', 'slots', ...modelOptionNames],
    multi: ['train'],
    flags: ['json'],
  });
  if (parsed.positional.length > 0)
    throw new UsageError(`unexpected argument ${JSON.stringify(parsed.positional[0])}`);
  const context = optionValue(parsed, 'context');
  if (context === undefined) throw new UsageError('missing --context "<text>"');
  const slots = integerIn('slots', optionValue(parsed, 'slots', '5'), 1, 100);
  const choice = modelChoice(parsed);
  const texts = readTrainingTexts(parsed, choice.base === 'none');
  const model = buildModel(choice, texts).fresh(false);
  const history = prepareText(context);
  const list = suggest(model, history, history.length, slots);
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
