import { existsSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { corporaCacheDir, corporaCacheFile, demoSamplesDir, repoRoot } from './data-paths';

describe('data paths', () => {
  it('finds the repository root: the folder whose package.json lists the workspaces', () => {
    const manifest = JSON.parse(readFileSync(join(repoRoot, 'package.json'), 'utf8')) as {
      workspaces: string[];
    };
    expect(manifest.workspaces).toEqual(expect.arrayContaining(['api', 'shared']));
    expect(existsSync(join(demoSamplesDir))).toBe(true);
  });

  it('reads the corpora cache from KEYLOOM_CORPORA_CACHE, relative to the root or absolute', () => {
    expect(corporaCacheDir({})).toBe(join(repoRoot, 'corpora', '.cache'));
    expect(corporaCacheDir({ KEYLOOM_CORPORA_CACHE: 'data/cache' })).toBe(join(repoRoot, 'data', 'cache'));
    expect(corporaCacheFile('base-model.bin', { KEYLOOM_CORPORA_CACHE: '/srv/keyloom/cache' })).toBe(
      '/srv/keyloom/cache/base-model.bin',
    );
  });
});
