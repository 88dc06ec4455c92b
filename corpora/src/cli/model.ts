// `npm run -s model -- <command> ...`: the engine's command line.
// Each command lives in its own file; this one only dispatches (and prints `--help`). Bad
// arguments print one line naming the problem and exit with code 2 (see cli-errors.ts).
import { runCompress, runDecompress } from './compress-command';
import { runEvaluate } from './evaluate-command';
import { runSuggest } from './suggest-command';
import { runBench } from './bench-command';
import { UsageError } from './cli-errors';

const commands: Record<string, (args: string[]) => Promise<void>> = {
  evaluate: runEvaluate,
  compress: runCompress,
  decompress: runDecompress,
  suggest: runSuggest,
  bench: runBench,
};

/** What `model --help` (also `model help`, `-h`) prints. */
export const HELP = `Usage: npm run -s model -- <command> [options]

Commands:
  evaluate --train FILE... --test FILE [model options] [--adaptive on|off] [--json]
      train on the --train files, then measure the --test file (bits per character,
      keystroke savings and keystrokes per character for 1..10 slots, scan steps,
      offered non-words)
  suggest [--train FILE...] --context "TEXT" [--slots 5] [model options] [--json]
      the suggestion list at the end of TEXT (without --train a base is needed)
  compress [--order 5] [--escape C] IN OUT    code a text file with the engine
  decompress IN OUT                           decode it back
  bench [--json] [--profile-only | --keyboard-only | --suggestions-only] [--vocabulary FILE.json]
      the engine's speed, size, memory and quality figures (also npm run bench)

Model options (evaluate, suggest):
  --order 0..12 (5)   --escape A|B|C|D (C)   --exclusion on|off (on)
  --base none|brown (none) | --base-corpus FILE...   --base-weight auto|0..1 (auto)
  --predictor word|char (word)
  --vocabulary FILE.json
      the client's added and blocked words, as the API keeps them:
      {"additions":[{"text":"Okafor","weight":3}],"blocks":[{"word":"darn","replacement":"dear"}]}
      additions are learned into the client's word model, blocked words are never
      offered (a replacement in their place); word-aware list only. bench applies it
      to the profile pipeline, the demo version and the test keyboard's list.

Bad arguments or files print one line and exit with code 2.
`;

async function main(argv: string[]): Promise<void> {
  const [name, ...rest] = argv;
  if (name === '--help' || name === '-h' || name === 'help') {
    process.stdout.write(HELP);
    return;
  }
  const command = name === undefined ? undefined : commands[name];
  if (!command) {
    throw new UsageError(
      `unknown command ${name === undefined ? '(none)' : JSON.stringify(name)}; expected one of ${Object.keys(commands).join(', ')}`,
    );
  }
  await command(rest);
}

main(process.argv.slice(2)).catch((error: unknown) => {
  const message = error instanceof Error ? error.message : String(error);
  process.stderr.write(`model: ${message}\n`);
  process.exit(error instanceof UsageError ? 2 : 1);
});
