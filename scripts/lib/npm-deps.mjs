// npm packages: `npm ci` when node_modules is missing or was installed from another lockfile.
import { createHash } from 'node:crypto';
import { existsSync, readFileSync, statSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { note, shown, StepError } from './output.mjs';
import { repoRoot, runPath } from './paths.mjs';
import { run } from './processes.mjs';

const stampName = '.keyloom-lock-hash';

const lockHash = (lockFile) => createHash('sha256').update(readFileSync(lockFile)).digest('hex');

/**
 * Is `dir/node_modules` installed from the current `dir/package-lock.json`? Yes when our stamp
 * holds the lock's hash, or when npm's own hidden lockfile (node_modules/.package-lock.json) is at
 * least as new as package-lock.json: an `npm install` run by hand updates both, while a pull that
 * changes the lock makes it newer than the installed tree. The stamp is refreshed in that case.
 */
function upToDate(dir, hash) {
  const modules = join(dir, 'node_modules');
  const stamp = join(modules, stampName);
  if (existsSync(stamp) && readFileSync(stamp, 'utf8').trim() === hash) return true;
  const hidden = join(modules, '.package-lock.json');
  if (!existsSync(hidden)) return false;
  if (statSync(hidden).mtimeMs + 1000 < statSync(join(dir, 'package-lock.json')).mtimeMs) return false;
  writeFileSync(stamp, `${hash}\n`);
  return true;
}

/**
 * Make `dir/node_modules` match `dir/package-lock.json`, running `npm ci` (retried once:
 * registry connections do get reset) when it does not.
 * @param {string} dir folder with package.json and package-lock.json
 * @param {string} label what to call it in messages, e.g. "npm packages"
 * @returns {Promise<string>} the line to print
 */
export async function ensureNpmTree(dir, label) {
  const lockFile = join(dir, 'package-lock.json');
  if (!existsSync(lockFile)) throw new StepError(`${shown(lockFile)} is missing`);
  const hash = lockHash(lockFile);
  if (upToDate(dir, hash)) return `${label} up to date (lock ${hash.slice(0, 8)})`;

  const logFile = runPath(dir === repoRoot ? 'npm-ci.log' : `npm-ci-${dir.split('/').pop()}.log`);
  const args = ['ci', '--no-audit', '--no-fund'];
  note(`${label}: npm ci in ${shown(dir) || '.'} (a minute on a fresh machine)…`);
  // Under `npm start`/`npm test` the parent npm exports its settings as npm_config_* variables,
  // which would override the folder's own .npmrc (tools/mail relaxes engine-strict): drop them.
  const env = Object.fromEntries(Object.entries(process.env).filter(([key]) => !/^npm_/i.test(key)));
  let result = await run('npm', args, { cwd: dir, logFile, env });
  if (result.code !== 0) {
    note(`${label}: npm ci failed (exit ${result.code}), retrying once…`);
    result = await run('npm', args, { cwd: dir, logFile, env });
  }
  if (result.code !== 0) throw new StepError(`npm ci in ${shown(dir) || '.'} failed twice`, logFile);
  writeFileSync(join(dir, 'node_modules', stampName), `${hash}\n`);
  return `${label} installed with npm ci (lock ${hash.slice(0, 8)})`;
}
