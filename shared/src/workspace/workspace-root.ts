// The repository root as the npm workspaces define it: the nearest folder at or above a start
// folder whose package.json lists "workspaces". Node-only callers (the API's data paths, the
// corpora workspace's paths) pass Node's file and path functions in, so this package stays free of
// Node's types and runs in the browser too.

/** What the search needs from the file system. */
export type WorkspaceRootHost = {
  /** The file's text, or undefined when there is none. */
  readText(file: string): string | undefined;
  dirname(path: string): string;
  join(dir: string, name: string): string;
};

/** The nearest folder at or above `from` whose package.json has a "workspaces" field. */
export function findWorkspaceRoot(from: string, host: WorkspaceRootHost): string {
  for (let dir = from; ; dir = host.dirname(dir)) {
    const manifest = host.readText(host.join(dir, 'package.json'));
    if (manifest !== undefined && 'workspaces' in (JSON.parse(manifest) as object)) return dir;
    if (host.dirname(dir) === dir)
      throw new Error(`No npm workspace root (package.json with "workspaces") above ${from}`);
  }
}
