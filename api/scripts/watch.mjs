// `npm run dev -w @keyloom/api`: the TypeScript compiler in watch mode beside `node --watch dist/main.js`,
// which restarts the API whenever the compiler rewrites dist/. Run after a build (the script does
// `npm run build` first). Ctrl-C or SIGTERM stops both.
import { spawn } from 'node:child_process';
import { createRequire } from 'node:module';

const tsc = createRequire(import.meta.url).resolve('typescript/bin/tsc');
const children = [
  spawn(process.execPath, [tsc, '-p', 'tsconfig.build.json', '--watch', '--preserveWatchOutput'], {
    stdio: 'inherit',
  }),
  spawn(process.execPath, ['--watch', 'dist/main.js'], { stdio: 'inherit' }),
];

let stopping = false;
function stop(code) {
  if (!stopping) for (const child of children) if (child.exitCode === null) child.kill('SIGTERM');
  stopping = true;
  process.exitCode = code;
}
for (const signal of ['SIGINT', 'SIGTERM']) process.on(signal, () => stop(0));
for (const child of children) child.on('exit', (code) => stop(stopping ? process.exitCode : (code ?? 1)));
