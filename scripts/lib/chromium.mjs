// Debian's Chromium for the browser tests (playwright-core drives it; no browser download).
import { existsSync } from 'node:fs';
import { aptInstall } from './apt.mjs';
import { run } from './processes.mjs';

export const chromiumPath = '/usr/bin/chromium';

/**
 * Make sure /usr/bin/chromium exists; apt-get install it when missing and running as root.
 * @returns {Promise<string>} the line to print
 */
export async function ensureChromium() {
  let how = 'installed';
  if (!existsSync(chromiumPath)) {
    await aptInstall(['chromium']);
    how = 'installed with apt-get';
  }
  // The wrapper script prints a harmless "[: …: unexpected operator" on some machines; keep stdout only.
  const { output } = await run(chromiumPath, ['--version']);
  const version = output.match(/Chromium [\d.]+/)?.[0] ?? 'Chromium';
  return `${version} ${how}`;
}
