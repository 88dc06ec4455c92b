// Console output for the set-up scripts: one short line per step, and on failure
// the reason plus where the full log is.
import { existsSync, readFileSync } from 'node:fs';
import { relative } from 'node:path';
import { repoRoot } from './paths.mjs';

const useColour = process.stdout.isTTY && !process.env.NO_COLOR;
const paint = (code, text) => (useColour ? `\u001b[${code}m${text}\u001b[0m` : text);

export const green = (text) => paint('32', text);
export const red = (text) => paint('31', text);
export const yellow = (text) => paint('33', text);
export const bold = (text) => paint('1', text);
export const dim = (text) => paint('2', text);

/** A failure that knows which log file explains it. */
export class StepError extends Error {
  /**
   * @param {string} message what went wrong, in one line
   * @param {string} [logFile] absolute path of the log with the details
   */
  constructor(message, logFile) {
    super(message);
    this.name = 'StepError';
    this.logFile = logFile;
  }
}

/** Repo-relative path for display (absolute when outside the repo). */
export function shown(path) {
  const rel = relative(repoRoot, path);
  return rel.startsWith('..') ? path : rel;
}

/** Seconds with one decimal, e.g. "1.4 s". */
export function seconds(ms) {
  return `${(ms / 1000).toFixed(1)} s`;
}

export function done(message, ms) {
  console.log(`${green('✓')} ${message}${ms === undefined ? '' : dim(` (${seconds(ms)})`)}`);
}

export function note(message) {
  console.log(`${dim('…')} ${message}`);
}

export function warn(message) {
  console.log(`${yellow('!')} ${message}`);
}

/**
 * Last lines of the latest command in a log file, indented, for a failure report; npm's own
 * "npm error …" footer is left out when there is anything else to show.
 */
export function logTail(logFile, lines = 15) {
  if (!logFile || !existsSync(logFile)) return '';
  const all = readFileSync(logFile, 'utf8').trimEnd();
  const latest = all.slice(all.lastIndexOf('\n$ ') + 1).split('\n');
  const useful = latest.filter((line) => line.trim() !== '' && !/^npm (error|ERR!)/.test(line));
  const text = (useful.length > 1 ? useful : latest).slice(-lines);
  return text.map((line) => dim(`    ${line}`)).join('\n');
}

/** Print a failed step: the reason, the end of its log and the log's path. */
export function failed(label, error) {
  const message = error instanceof Error ? error.message : String(error);
  console.log(`${red('✗')} ${label}: ${message}`);
  if (error instanceof StepError && error.logFile) {
    const tail = logTail(error.logFile);
    if (tail) console.log(tail);
    console.log(`  full log: ${shown(error.logFile)}`);
  } else if (!(error instanceof StepError) && error instanceof Error && error.stack) {
    console.log(dim(error.stack.split('\n').slice(1, 4).join('\n')));
  }
}

/**
 * Run one step and print one line: what it did (the string fn returns) and how long it took.
 * On failure prints the reason and the log, then rethrows.
 * @param {string} label short name of the step, used in the failure line
 * @param {() => Promise<string>} fn does the work, returns the success line
 */
export async function step(label, fn) {
  const started = Date.now();
  try {
    const message = await fn();
    done(message, Date.now() - started);
    return message;
  } catch (error) {
    failed(label, error);
    throw error;
  }
}
