// Where the API finds the files it does not own, in one place (no `..` counting elsewhere):
// - the repository root: the nearest folder above this module whose package.json lists workspaces
//   (api/src/config in development, api/dist/config when built: both find the same root);
// - the corpora cache (the base model, the base vocabulary, the word list): KEYLOOM_CORPORA_CACHE,
//   relative to the repository root or absolute, by default corpora/.cache — the same setting and
//   default as the corpora workspace's own paths module, so `npm run corpora` builds where we read;
// - the invented demo samples the seed uploads: corpora/demo.
// Read before Nest starts (the worker and the seed read the files first), so from process.env;
// the variable is also declared in env.schema.ts for its documentation and validation.
import { findWorkspaceRoot } from '@keyloom/shared';
import { existsSync, readFileSync } from 'node:fs';
import { dirname, isAbsolute, join, resolve } from 'node:path';

/** The repository root (found once). */
export const repoRoot = findWorkspaceRoot(__dirname, {
  readText: (file) => (existsSync(file) ? readFileSync(file, 'utf8') : undefined),
  dirname,
  join,
});

/** A folder setting: absolute as given, relative to the repository root otherwise. */
export const fromRepoRoot = (dir: string): string => (isAbsolute(dir) ? dir : resolve(repoRoot, dir));

/** The corpora cache folder (KEYLOOM_CORPORA_CACHE, default corpora/.cache). */
export const corporaCacheDir = (env: NodeJS.ProcessEnv = process.env): string =>
  fromRepoRoot(env.KEYLOOM_CORPORA_CACHE || join('corpora', '.cache'));

/** A file in the corpora cache: base-model.bin, base-words.bin, lexicon.tsv. */
export const corporaCacheFile = (name: string, env: NodeJS.ProcessEnv = process.env): string =>
  join(corporaCacheDir(env), name);

/** The demo samples the seed uploads for the Willowmere demo clinic. */
export const demoSamplesDir = join(repoRoot, 'corpora', 'demo');
