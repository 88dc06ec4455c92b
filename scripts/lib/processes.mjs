// Child processes: run a command to completion (output to a log), start a detached server
// with a pid file, find it again (guarding against PID reuse) and stop it.
import { spawn } from 'node:child_process';
import { closeSync, existsSync, openSync, readFileSync, readlinkSync, rmSync, writeFileSync } from 'node:fs';
import { StepError } from './output.mjs';
import { runPath } from './paths.mjs';

export const isRoot = () => typeof process.getuid === 'function' && process.getuid() === 0;

export const sleep = (ms) => new Promise((resolve) => setTimeout(resolve, ms));

/**
 * Run a command to completion.
 * @param {string} command executable
 * @param {string[]} args arguments
 * @param {object} [options]
 * @param {string} [options.cwd] working directory
 * @param {NodeJS.ProcessEnv} [options.env] full environment (default: this process's)
 * @param {string} [options.logFile] append stdout+stderr here (with a header line)
 * @param {string} [options.input] text written to stdin
 * @param {boolean} [options.echo] also copy output to this process's stdout/stderr
 * @param {(child: import('node:child_process').ChildProcess) => void} [options.onChild] gets the child (to signal it)
 * @returns {Promise<{code: number, output: string}>} exit code (signal → 128+n) and combined output
 */
export function run(command, args, { cwd, env, logFile, input, echo = false, onChild } = {}) {
  return new Promise((resolve, reject) => {
    const log = logFile ? openSync(logFile, 'a') : undefined;
    if (log !== undefined) {
      writeFileSync(log, `\n$ ${[command, ...args].join(' ')}   # ${new Date().toISOString()}\n`);
    }
    let logOpen = log !== undefined;
    const closeLog = () => {
      if (logOpen) closeSync(/** @type {number} */ (log));
      logOpen = false;
    };
    const child = spawn(command, args, { cwd, env: env ?? process.env, stdio: ['pipe', 'pipe', 'pipe'] });
    onChild?.(child);
    let output = '';
    const collect = (stream, target) => {
      stream.on('data', (chunk) => {
        output += chunk;
        if (logOpen) writeFileSync(/** @type {number} */ (log), chunk);
        if (echo) target.write(chunk);
      });
    };
    collect(child.stdout, process.stdout);
    collect(child.stderr, process.stderr);
    child.stdin.on('error', () => {}); // a command that ignores stdin may close it early
    child.stdin.end(input ?? '');
    child.on('error', (error) => {
      closeLog();
      reject(new StepError(`cannot run ${command}: ${error.message}`, logFile));
    });
    child.on('close', (code, signal) => {
      closeLog();
      const signalCode = signal ? 128 + (signalNumbers[signal] ?? 0) : 1;
      resolve({ code: code ?? signalCode, output });
    });
  });
}

const signalNumbers = { SIGHUP: 1, SIGINT: 2, SIGKILL: 9, SIGTERM: 15 };

/** Like run(), but throws a StepError naming the log when the exit code is not 0. */
export async function runChecked(what, command, args, options = {}) {
  const result = await run(command, args, options);
  if (result.code !== 0) {
    const lastLine = result.output.trim().split('\n').pop() ?? '';
    const reason = options.logFile ? `exit code ${result.code}` : `exit code ${result.code}: ${lastLine}`;
    throw new StepError(`${what} failed (${reason})`, options.logFile);
  }
  return result;
}

/**
 * Start a long-running process detached from this one (its own process group), with stdout
 * and stderr appended to a log file and its PID in .run/<name>.pid.
 * @returns {number} the PID
 */
export function startDetached(name, command, args, { cwd, env, logFile }) {
  const log = openSync(logFile, 'a');
  writeFileSync(log, `\n$ ${[command, ...args].join(' ')}   # ${new Date().toISOString()}\n`);
  const child = spawn(command, args, { cwd, env, detached: true, stdio: ['ignore', log, log] });
  closeSync(log);
  child.on('error', () => {}); // reported by the caller's readiness check instead
  child.unref();
  if (child.pid === undefined) throw new StepError(`cannot start ${command}`, logFile);
  writeFileSync(pidFile(name), `${child.pid}\n`);
  return child.pid;
}

export const pidFile = (name) => runPath(`${name}.pid`);

/** The command line of a live process, or null when it is gone or a zombie. */
export function commandLine(pid) {
  try {
    const stat = readFileSync(`/proc/${pid}/stat`, 'utf8');
    const state = stat.slice(stat.lastIndexOf(')') + 2, stat.lastIndexOf(')') + 3);
    if (state === 'Z' || state === 'X') return null;
    return readFileSync(`/proc/${pid}/cmdline`, 'utf8').split('\0').filter(Boolean);
  } catch {
    return null;
  }
}

export const isAlive = (pid) => commandLine(pid) !== null;

/** The working directory of a process, or null when it cannot be read. */
export function workingDirectory(pid) {
  try {
    return readlinkSync(`/proc/${pid}/cwd`);
  } catch {
    return null;
  }
}

/**
 * PID from .run/<name>.pid when that process is still alive AND its command line contains
 * every one of `mustContain` (so a recycled PID is not mistaken for ours). A stale file is removed.
 * @param {string} name pid-file name without extension
 * @param {string[]} mustContain words that must appear in the process's argv
 */
export function livePid(name, mustContain) {
  const file = pidFile(name);
  if (!existsSync(file)) return null;
  const pid = Number(readFileSync(file, 'utf8').trim());
  const argv = Number.isInteger(pid) && pid > 0 ? commandLine(pid) : null;
  const ours = argv !== null && mustContain.every((word) => argv.some((arg) => arg.includes(word)));
  if (!ours) {
    rmSync(file, { force: true });
    return null;
  }
  return pid;
}

/** Wait until a process has gone; returns false on timeout. */
export async function waitForExit(pid, timeoutMs) {
  const deadline = Date.now() + timeoutMs;
  while (isAlive(pid)) {
    if (Date.now() > deadline) return false;
    await sleep(100);
  }
  return true;
}

function signal(pid, name) {
  try {
    process.kill(-pid, name); // the whole group: we start servers as group leaders
  } catch {
    try {
      process.kill(pid, name);
    } catch {
      // already gone
    }
  }
}

/**
 * Stop a process: SIGTERM (graceful), then SIGKILL after `graceMs`.
 * @returns {Promise<boolean>} true when it had to be killed
 */
export async function stopProcess(pid, graceMs = 10_000) {
  signal(pid, 'SIGTERM');
  if (await waitForExit(pid, graceMs)) return false;
  signal(pid, 'SIGKILL');
  await waitForExit(pid, 5_000);
  return true;
}

/**
 * Stop the process recorded in .run/<name>.pid, if it is alive and ours.
 * @returns {Promise<number|null>} the PID that was stopped, or null when nothing ran
 */
export async function stopNamed(name, mustContain, graceMs) {
  const pid = livePid(name, mustContain);
  if (pid !== null) await stopProcess(pid, graceMs);
  rmSync(pidFile(name), { force: true });
  return pid;
}
