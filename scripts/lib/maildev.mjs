// The fake mail server (maildev, installed in tools/mail/, outside the workspaces): SMTP and a
// web inbox with a JSON API, both on 127.0.0.1 only.
import { existsSync, mkdirSync } from 'node:fs';
import { join } from 'node:path';
import { ensureNpmTree } from './npm-deps.mjs';
import { shown, StepError } from './output.mjs';
import { repoRoot, runPath } from './paths.mjs';
import { portInUse, waitForHttp } from './ports.mjs';
import { commandLine, isAlive, livePid, startDetached, stopNamed, stopProcess } from './processes.mjs';

const toolDir = join(repoRoot, 'tools', 'mail');
const entry = join(toolDir, 'node_modules', 'maildev', 'dist', 'bin', 'maildev.js');

/** npm ci in tools/mail when its node_modules is missing or stale. */
export function ensureMaildevInstalled() {
  return ensureNpmTree(toolDir, 'fake mail server packages (tools/mail)');
}

/** Ask maildev's JSON API whether it answers. */
const inboxApi = (webPort) => `http://127.0.0.1:${webPort}/api/email`;

/**
 * Start maildev detached (pid in .run/<name>.pid, log in .run/<name>.log), or reuse the one
 * already running with the same ports.
 * @param {{name: string, smtpPort: number, webPort: number, mailDir: string}} options
 * @returns {Promise<string>} the line to print
 */
export async function startMaildev({ name, smtpPort, webPort, mailDir }) {
  const portArgs = ['-s', String(smtpPort), '-w', String(webPort)];
  const running = livePid(name, ['maildev.js']);
  if (running !== null) {
    const argv = (commandLine(running) ?? []).join(' ');
    const sameConfig =
      argv.includes(portArgs.join(' ')) &&
      (await waitForHttp(inboxApi(webPort), { timeoutMs: 2000 })) === 'ok';
    if (sameConfig)
      return `fake mail server already running (pid ${running}, inbox http://127.0.0.1:${webPort})`;
    await stopProcess(running); // started with other ports, or not answering: replace it
  }
  if (!existsSync(entry))
    throw new StepError(`${shown(entry)} is missing (npm ci in tools/mail did not install it)`);
  for (const port of [smtpPort, webPort]) {
    if (await portInUse(port)) {
      throw new StepError(
        `port ${port} is already taken on 127.0.0.1 (set SMTP_PORT / MAIL_WEB_PORT to move maildev)`,
      );
    }
  }
  mkdirSync(mailDir, { recursive: true });
  const logFile = runPath(`${name}.log`);
  const pid = startDetached(
    name,
    process.execPath,
    [entry, '--ip', '127.0.0.1', '--web-ip', '127.0.0.1', ...portArgs, '--mail-directory', mailDir],
    { cwd: repoRoot, env: { ...process.env, NODE_ENV: 'development' }, logFile },
  );
  const ready = await waitForHttp(inboxApi(webPort), { timeoutMs: 20_000, stillRunning: () => isAlive(pid) });
  if (ready !== 'ok') {
    await stopNamed(name, ['maildev.js']);
    throw new StepError(
      `maildev ${ready === 'exited' ? 'exited' : 'did not answer'} on port ${webPort}`,
      logFile,
    );
  }
  return `fake mail server started (pid ${pid}, SMTP 127.0.0.1:${smtpPort}, inbox http://127.0.0.1:${webPort})`;
}

/** Stop maildev started under this name; returns the PID or null. */
export function stopMaildev(name) {
  return stopNamed(name, ['maildev.js']);
}
