// TCP ports on the loopback interface: pick free ones, check whether one is taken, and wait
// for an HTTP endpoint to answer.
import { request } from 'node:http';
import { connect, createServer } from 'node:net';
import { sleep } from './processes.mjs';

const handedOut = new Set();

/** A port that is free right now on 127.0.0.1 (chosen by the kernel; never the same twice per run). */
export async function freePort() {
  for (;;) {
    const port = await new Promise((resolve, reject) => {
      const server = createServer();
      server.unref();
      server.on('error', reject);
      server.listen(0, '127.0.0.1', () => {
        const address = server.address();
        server.close(() => resolve(typeof address === 'object' && address ? address.port : 0));
      });
    });
    if (!handedOut.has(port)) {
      handedOut.add(port);
      return port;
    }
  }
}

/** True when something accepts TCP connections on host:port. */
export function portInUse(port, host = '127.0.0.1') {
  return new Promise((resolve) => {
    const socket = connect({ port, host });
    const finish = (answer) => {
      socket.destroy();
      resolve(answer);
    };
    socket.setTimeout(1000, () => finish(false));
    socket.once('connect', () => finish(true));
    socket.once('error', () => finish(false));
  });
}

/** GET a URL; resolves with the status code (0 when nothing answers). */
export function httpStatus(url, timeoutMs = 2000) {
  return new Promise((resolve) => {
    const req = request(url, { method: 'GET', headers: { accept: 'application/json' } }, (res) => {
      res.resume();
      resolve(res.statusCode ?? 0);
    });
    req.setTimeout(timeoutMs, () => req.destroy());
    req.on('error', () => resolve(0));
    req.end();
  });
}

/**
 * Poll a URL until it answers 200.
 * @param {string} url
 * @param {object} options
 * @param {number} options.timeoutMs give up after this long
 * @param {() => boolean} [options.stillRunning] stop early when the server process has died
 * @returns {Promise<'ok'|'timeout'|'exited'>}
 */
export async function waitForHttp(url, { timeoutMs, stillRunning }) {
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    if ((await httpStatus(url)) === 200) return 'ok';
    if (stillRunning && !stillRunning()) return 'exited';
    await sleep(250);
  }
  return 'timeout';
}
