// Debian packages (PostgreSQL, Chromium) installed with apt-get when missing and running as root.
import { existsSync, readdirSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { note } from './output.mjs';
import { isRoot, run, runChecked } from './processes.mjs';
import { runPath } from './paths.mjs';

const listsDir = '/var/lib/apt/lists';
const policyFile = '/usr/sbin/policy-rc.d';
const staleAfterMs = 7 * 24 * 3600 * 1000;

const aptEnv = () => ({ ...process.env, DEBIAN_FRONTEND: 'noninteractive', NEEDRESTART_MODE: 'a' });
// Wait for another apt/dpkg run (e.g. a second clone's set-up) instead of failing at once.
const lockWait = ['-o', 'DPkg::Lock::Timeout=300'];

/** True when the package lists are missing or older than a week. */
function listsAreStale() {
  if (!existsSync(listsDir)) return true;
  const lists = readdirSync(listsDir).filter((name) => name.includes('_Packages'));
  if (lists.length === 0) return true;
  const newest = Math.max(...lists.map((name) => statSync(`${listsDir}/${name}`).mtimeMs));
  return Date.now() - newest > staleAfterMs;
}

/**
 * apt-get install the packages (root only). With `noServiceStart`, a temporary policy-rc.d
 * stops Debian from starting the package's own service (e.g. a default PostgreSQL on 5432).
 * @param {string[]} packages Debian package names
 * @param {{noServiceStart?: boolean}} [options]
 * @returns {Promise<string>} the log file
 */
export async function aptInstall(packages, { noServiceStart = false } = {}) {
  if (!isRoot()) {
    throw new Error(
      `${packages.join(', ')} not installed; install with: sudo apt-get install -y ${packages.join(' ')}`,
    );
  }
  const logFile = runPath('apt.log');
  const options = { env: aptEnv(), logFile };
  let updated = false;
  if (listsAreStale()) {
    note('apt-get update (package lists missing or older than a week)…');
    await runChecked('apt-get update', 'apt-get', ['update', ...lockWait], options);
    updated = true;
  }
  const placedPolicy = noServiceStart && !existsSync(policyFile);
  if (placedPolicy)
    writeFileSync(policyFile, '#!/bin/sh\n# Keyloom set-up: do not start services\nexit 101\n', {
      mode: 0o755,
    });
  try {
    note(`apt-get install ${packages.join(' ')}…`);
    const install = ['install', '-y', ...lockWait, ...packages];
    const first = await run('apt-get', install, options);
    if (first.code !== 0) {
      // A stale list points at versions the mirror no longer has: refresh once and retry.
      if (!updated) await runChecked('apt-get update', 'apt-get', ['update', ...lockWait], options);
      await runChecked(`apt-get install ${packages.join(' ')}`, 'apt-get', install, options);
    }
  } finally {
    if (placedPolicy) rmSync(policyFile, { force: true });
  }
  return logFile;
}
