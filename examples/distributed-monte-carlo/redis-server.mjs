/**
 * A throwaway Redis server for the example and its test: the Debian `redis-server` program on the
 * loopback address, on a free port, in its own temporary folder, with persistence off. `stop()`
 * shuts it down and removes the folder.
 */
import { spawn } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import { createConnection, createServer } from 'node:net';
import { tmpdir } from 'node:os';
import { join } from 'node:path';

const HOST = '127.0.0.1';

/** A port the system has free on the loopback address now. */
function freePort() {
  return new Promise((resolve, reject) => {
    const probe = createServer();
    probe.once('error', reject);
    probe.listen(0, HOST, () => {
      const { port } = probe.address();
      probe.close(() => resolve(port));
    });
  });
}

/** Resolve once something accepts connections on the port (at most `timeoutMs`). */
async function waitForPort(port, timeoutMs) {
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    const open = await new Promise((resolve) => {
      const socket = createConnection({ host: HOST, port }, () => {
        socket.end();
        resolve(true);
      });
      socket.once('error', () => resolve(false));
    });
    if (open) return;
    await new Promise((resolve) => setTimeout(resolve, 50));
  }
  throw new Error(`redis-server did not accept connections on ${HOST}:${port} within ${timeoutMs} ms`);
}

/** Start redis-server; returns `{ host, port, stop }`. */
export async function startRedis() {
  const port = await freePort();
  const dir = mkdtempSync(join(tmpdir(), 'quiescent-redis-'));
  const server = spawn(
    'redis-server',
    ['--bind', HOST, '--port', String(port), '--dir', dir, '--save', '', '--appendonly', 'no'],
    { stdio: 'ignore' },
  );
  const exited = new Promise((resolve) => server.once('exit', resolve));
  const failed = new Promise((_, reject) =>
    server.once('error', (e) =>
      reject(
        new Error(`could not start redis-server (${e.message}); install the Debian package redis-server`),
      ),
    ),
  );
  await Promise.race([waitForPort(port, 10_000), failed]);
  return {
    host: HOST,
    port,
    async stop() {
      if (server.exitCode === null) server.kill('SIGTERM');
      await exited;
      rmSync(dir, { recursive: true, force: true });
    },
  };
}
