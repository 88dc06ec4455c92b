// Project-local PostgreSQL clusters (app: db/.data, tests: db/.data-test) on 127.0.0.1 only.
// PostgreSQL refuses to run as root, so as root every server command runs as the `postgres`
// system user (runuser, from cwd /); otherwise as the current user.
import { spawnSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import {
  chownSync,
  existsSync,
  mkdirSync,
  readdirSync,
  readFileSync,
  realpathSync,
  rmSync,
  writeFileSync,
} from 'node:fs';
import { userInfo } from 'node:os';
import { dirname, join } from 'node:path';
import { aptInstall } from './apt.mjs';
import { shown, StepError } from './output.mjs';
import { repoRoot, runPath } from './paths.mjs';
import { portInUse } from './ports.mjs';
import { isAlive, isRoot, runChecked, sleep, workingDirectory } from './processes.mjs';

const installRoot = '/usr/lib/postgresql';

/** Installed server versions (major numbers), newest first. */
function installedMajors() {
  if (!existsSync(installRoot)) return [];
  return readdirSync(installRoot)
    .filter((major) => existsSync(join(installRoot, major, 'bin', 'postgres')))
    .sort((a, b) => Number(b) - Number(a));
}

/**
 * Make sure the PostgreSQL server binaries exist; as root, apt-get install them (with the
 * package's own default cluster kept from starting) when they do not.
 * @returns {Promise<string>} the line to print
 */
export async function ensurePostgresInstalled() {
  const found = installedMajors();
  if (found.length > 0) return `PostgreSQL ${found[0]} installed`;
  await aptInstall(['postgresql'], { noServiceStart: true });
  const now = installedMajors();
  if (now.length === 0)
    throw new StepError(`apt-get installed postgresql but ${installRoot}/*/bin/postgres is missing`);
  return `PostgreSQL ${now[0]} installed with apt-get`;
}

/** Owner uid/gid of the `postgres` system user (root only). */
function postgresIds() {
  const line = readFileSync('/etc/passwd', 'utf8')
    .split('\n')
    .find((entry) => entry.startsWith('postgres:'));
  if (!line) throw new StepError('there is no `postgres` system user (is the postgresql package installed?)');
  const [, , uid, gid] = line.split(':');
  return { uid: Number(uid), gid: Number(gid) };
}

/** Command and arguments that run `command` as the cluster's OS user. */
function asServerUser(command, args) {
  return isRoot() ? ['runuser', ['-u', 'postgres', '--', command, ...args]] : [command, args];
}

/** Can the `postgres` user reach this folder (execute permission on it and every parent)? */
function reachableByPostgres(dir) {
  return spawnSync('runuser', ['-u', 'postgres', '--', 'test', '-x', dir], { cwd: '/' }).status === 0;
}

/**
 * Where a cluster lives and how to reach it.
 * @param {'app'|'test'} kind app cluster (db/.data) or test cluster (db/.data-test)
 * @param {number} port TCP port on 127.0.0.1
 */
export function describeCluster(kind, port) {
  const dbDir = join(repoRoot, 'db');
  mkdirSync(dbDir, { recursive: true });
  const folder = kind === 'app' ? '.data' : '.data-test';
  let dataDir = join(dbDir, folder);
  let logFile = runPath(`postgres-${kind}.log`);
  let fallback = false;
  if (isRoot() && !reachableByPostgres(dbDir)) {
    // e.g. a clone under /root (mode 0700): keep the data where the postgres user can reach it.
    const tag = createHash('sha256').update(repoRoot).digest('hex').slice(0, 10);
    const base = join('/var/lib/postgresql', `keyloom-${tag}`);
    dataDir = join(base, kind === 'app' ? 'data' : 'data-test');
    logFile = join(base, `postgres-${kind}.log`);
    fallback = true;
  }
  const socketFile = join(dataDir, `.s.PGSQL.${port}`);
  return {
    kind,
    port,
    dataDir,
    logFile,
    fallback,
    // Unix socket paths are limited to ~107 bytes.
    socketDir: socketFile.length <= 100 ? dataDir : '/tmp',
    superuser: isRoot() ? 'postgres' : userInfo().username,
  };
}

/** Fields of postmaster.pid, or null when there is none. */
function readPostmasterPid(dataDir) {
  const file = join(dataDir, 'postmaster.pid');
  if (!existsSync(file)) return null;
  const lines = readFileSync(file, 'utf8').split('\n');
  return { pid: Number(lines[0]), port: Number(lines[3]), socketDir: lines[4] ?? '' };
}

/** PIDs of processes whose working directory is `dir` (a postmaster and its children). */
function processesIn(dir) {
  return readdirSync('/proc')
    .filter((name) => /^\d+$/.test(name))
    .map(Number)
    .filter((pid) => workingDirectory(pid) === dir);
}

/**
 * Is the cluster running? A postmaster.pid left by a crash is cleared here: `pg_ctl status`
 * trusts any live PID in it, but after a restart that PID may belong to another program, so the
 * PID only counts when that process's working directory is the data folder.
 * @returns {Promise<{running: boolean, port?: number, socketDir?: string, pid?: number, staleCleared?: boolean}>}
 */
export async function clusterStatus(cluster) {
  if (!existsSync(cluster.dataDir)) return { running: false };
  const info = readPostmasterPid(cluster.dataDir);
  const realDir = realpathSync(cluster.dataDir);
  if (!info) {
    if (processesIn(realDir).length === 0)
      clearSocketLock(cluster.socketDir, cluster.port, cluster.dataDir, realDir);
    return { running: false };
  }
  if (info.pid > 0 && isAlive(info.pid) && workingDirectory(info.pid) === realDir) {
    return { running: true, port: info.port, socketDir: info.socketDir, pid: info.pid };
  }
  // Stale: wait for leftover children of a killed postmaster to exit, then remove the locks.
  const deadline = Date.now() + 15_000;
  let left = processesIn(realDir);
  while (left.length > 0 && Date.now() < deadline) {
    await sleep(200);
    left = processesIn(realDir);
  }
  if (left.length > 0) {
    throw new StepError(`old server processes ${left.join(', ')} still use ${shown(cluster.dataDir)}`);
  }
  rmSync(join(cluster.dataDir, 'postmaster.pid'), { force: true });
  clearSocketLock(info.socketDir || cluster.socketDir, info.port, cluster.dataDir, realDir);
  return { running: false, staleCleared: true };
}

/**
 * Remove a socket lock left by a dead server of this cluster (its line 2 names the data folder).
 * Call only when no process runs in the data folder: PostgreSQL itself would take a recycled or
 * zombie PID in the lock for a live server and refuse to start.
 */
function clearSocketLock(socketDir, port, dataDir, realDir) {
  const socketLock = join(socketDir, `.s.PGSQL.${port}.lock`);
  if (!existsSync(socketLock)) return;
  const owner = readFileSync(socketLock, 'utf8').split('\n')[1];
  if (owner !== dataDir && owner !== realDir) return;
  rmSync(socketLock, { force: true });
  rmSync(socketLock.replace(/\.lock$/, ''), { force: true });
}

/** Create the data folder with initdb when it holds no cluster yet. */
async function initCluster(cluster) {
  if (existsSync(join(cluster.dataDir, 'PG_VERSION'))) return false;
  rmSync(cluster.dataDir, { recursive: true, force: true }); // a half-made folder from a failed initdb
  mkdirSync(cluster.dataDir, { recursive: true, mode: 0o700 });
  if (isRoot()) {
    const { uid, gid } = postgresIds();
    if (cluster.fallback) chownSync(dirname(cluster.dataDir), uid, gid);
    chownSync(cluster.dataDir, uid, gid);
  }
  const major = installedMajors()[0];
  const [command, args] = asServerUser(join(installRoot, major, 'bin', 'initdb'), [
    '-D',
    cluster.dataDir,
    '--encoding=UTF8',
    '--no-locale',
    '--auth-local=peer',
    '--auth-host=scram-sha-256',
  ]);
  await runChecked('initdb', command, args, { cwd: '/', logFile: runPath('postgres-initdb.log') });
  return true;
}

/** Server binaries matching the major version that created the cluster. */
function binDirFor(cluster) {
  const major = readFileSync(join(cluster.dataDir, 'PG_VERSION'), 'utf8').trim();
  const bin = join(installRoot, major, 'bin');
  if (!existsSync(join(bin, 'postgres'))) {
    throw new StepError(
      `${shown(cluster.dataDir)} was made by PostgreSQL ${major}, which is not installed ` +
        `(installed: ${installedMajors().join(', ') || 'none'}); remove that folder to start afresh`,
    );
  }
  return bin;
}

/** Run pg_ctl as the server user. */
function pgCtl(cluster, args) {
  const [command, fullArgs] = asServerUser(join(binDirFor(cluster), 'pg_ctl'), [
    '-D',
    cluster.dataDir,
    ...args,
  ]);
  return runChecked(`pg_ctl ${args.at(-1)}`, command, fullArgs, {
    cwd: '/',
    logFile: runPath('postgres-ctl.log'),
  });
}

/**
 * Start the cluster on 127.0.0.1:<port>, creating it first when needed; reuse it when it already
 * runs on that port (restart it when it runs on another one).
 * @returns {Promise<string>} what happened, e.g. "created and started", "already running"
 */
export async function startCluster(cluster) {
  const status = await clusterStatus(cluster);
  if (status.running && status.port === cluster.port) {
    cluster.socketDir = status.socketDir || cluster.socketDir;
    return 'already running';
  }
  // Check the port before stopping a server that runs on another one (PGPORT_APP changed).
  if (await portInUse(cluster.port)) {
    throw new StepError(`port ${cluster.port} is already taken by another program on 127.0.0.1`);
  }
  let restarted = false;
  if (status.running) {
    await pgCtl(cluster, ['-m', 'fast', '-w', '-t', '60', 'stop']);
    restarted = true;
  }
  const created = await initCluster(cluster);
  if (!existsSync(cluster.logFile)) writeFileSync(cluster.logFile, '');
  if (isRoot()) {
    const { uid, gid } = postgresIds();
    chownSync(cluster.logFile, uid, gid);
  }
  const quotedSocketDir = `'${cluster.socketDir.replaceAll("'", "'\\''")}'`;
  const serverOptions = `-c listen_addresses=127.0.0.1 -p ${cluster.port} -c unix_socket_directories=${quotedSocketDir}`;
  try {
    await pgCtl(cluster, ['-l', cluster.logFile, '-w', '-t', '60', '-o', serverOptions, 'start']);
  } catch {
    throw new StepError(`PostgreSQL did not start on 127.0.0.1:${cluster.port}`, cluster.logFile);
  }
  if (created) return 'created and started';
  if (restarted) return 'restarted (port changed)';
  return status.staleCleared ? 'started (cleared a stale postmaster.pid)' : 'started';
}

/**
 * Stop the cluster (fast shutdown) when it runs.
 * @returns {Promise<boolean>} true when it was running
 */
export async function stopCluster(cluster) {
  const status = await clusterStatus(cluster);
  if (!status.running) return false;
  await pgCtl(cluster, ['-m', 'fast', '-w', '-t', '60', 'stop']);
  return true;
}

const literal = (text) => `'${text.replaceAll("'", "''")}'`;
const identifier = (text) => `"${text.replaceAll('"', '""')}"`;

/** Run SQL (psql script syntax, \gexec allowed) as the cluster's superuser over its Unix socket. */
export async function psql(cluster, sql) {
  const [command, args] = asServerUser(join(binDirFor(cluster), 'psql'), [
    '-X',
    '-q',
    '-v',
    'ON_ERROR_STOP=1',
    '-h',
    cluster.socketDir,
    '-p',
    String(cluster.port),
    '-U',
    cluster.superuser,
    '-d',
    'postgres',
    '-f',
    '-',
  ]);
  return runChecked('psql', command, args, { cwd: '/', input: sql, logFile: runPath('postgres-setup.log') });
}

/**
 * Create the login role (or reset its password) and its databases, idempotently.
 * @param {object} cluster from describeCluster()
 * @param {{role: string, password: string, databases: string[], fresh?: boolean}} spec
 *   fresh: drop and recreate the databases (test runs start from empty databases)
 */
export async function ensureRoleAndDatabases(cluster, { role, password, databases, fresh = false }) {
  const lines = [
    `SELECT 'CREATE ROLE ${identifier(role)}' WHERE NOT EXISTS (SELECT FROM pg_roles WHERE rolname = ${literal(role)})\\gexec`,
    `ALTER ROLE ${identifier(role)} LOGIN PASSWORD ${literal(password)};`,
  ];
  for (const name of databases) {
    if (fresh) lines.push(`DROP DATABASE IF EXISTS ${identifier(name)} WITH (FORCE);`);
    lines.push(
      `SELECT 'CREATE DATABASE ${identifier(name)} OWNER ${identifier(role)}' ` +
        `WHERE NOT EXISTS (SELECT FROM pg_database WHERE datname = ${literal(name)})\\gexec`,
    );
  }
  await psql(cluster, `${lines.join('\n')}\n`);
}

/** Human-readable location of the cluster for the step line. */
export function clusterPlace(cluster) {
  return cluster.fallback
    ? `${cluster.dataDir} (repo not reachable by the postgres user)`
    : shown(cluster.dataDir);
}
