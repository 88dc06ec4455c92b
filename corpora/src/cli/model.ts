// `npm run -s model -- <command> ...`: the engine's command line.
// Each command lives in its own file; this one only dispatches. Bad arguments
// print one line naming the problem and exit with code 2 (see cli-errors.ts).
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

async function main(argv: string[]): Promise<void> {
  const [name, ...rest] = argv;
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
