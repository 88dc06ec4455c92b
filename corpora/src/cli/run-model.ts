// The `model` command spawned exactly as `npm run model` runs it (for the command-line tests).
import { spawnSync } from 'node:child_process';
import { tsxEnvironment, workspaceRoot } from '../paths';

export function model(...args: string[]): { status: number | null; stdout: string; stderr: string } {
  const run = spawnSync(process.execPath, ['--import', 'tsx', 'corpora/src/cli/model.ts', ...args], {
    cwd: workspaceRoot,
    env: tsxEnvironment(),
    encoding: 'utf8',
    timeout: 120_000,
  });
  return { status: run.status, stdout: run.stdout, stderr: run.stderr };
}
