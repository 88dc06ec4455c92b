import { describe, expect, it } from 'vitest';
import { findWorkspaceRoot, type WorkspaceRootHost } from './workspace-root';

// A POSIX-like tree in memory: /repo/package.json lists workspaces, /repo/api/package.json does not.
const files: Record<string, string> = {
  '/repo/package.json': JSON.stringify({ name: 'root', workspaces: ['api'] }),
  '/repo/api/package.json': JSON.stringify({ name: '@x/api' }),
};
const host: WorkspaceRootHost = {
  readText: (file) => files[file],
  dirname: (path) => path.slice(0, Math.max(path.lastIndexOf('/'), 1)),
  join: (dir, name) => `${dir === '/' ? '' : dir}/${name}`,
};

describe('findWorkspaceRoot', () => {
  it('skips a workspace package and stops at the package.json that lists workspaces', () => {
    expect(findWorkspaceRoot('/repo/api/dist/config', host)).toBe('/repo');
    expect(findWorkspaceRoot('/repo', host)).toBe('/repo');
  });

  it('says so when no folder above has one', () => {
    expect(() => findWorkspaceRoot('/elsewhere/deep', host)).toThrow(/No npm workspace root/);
  });
});
