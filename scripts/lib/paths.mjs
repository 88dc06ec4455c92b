// Where things live: the repo root and the git-ignored run-state folder.
import { mkdirSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';

export const repoRoot = dirname(dirname(dirname(fileURLToPath(import.meta.url))));

/** Pid files and logs of everything the scripts start (git-ignored). */
export const runDir = join(repoRoot, '.run');

/** Path inside .run/, creating .run/ (and sub-folders) on first use. */
export function runPath(...parts) {
  const path = join(runDir, ...parts);
  mkdirSync(dirname(path), { recursive: true });
  return path;
}
