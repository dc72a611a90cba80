// Starting Namesake (or one of its fakes) as a process of its own, for the scripts, benchmarks and
// tests that drive a real server over HTTP: a free port, the client build, the process with its
// output kept for error messages, waiting until it answers, and stopping it again.
import { type ChildProcess, spawn, spawnSync } from 'node:child_process';
import fs from 'node:fs';
import net from 'node:net';
import path from 'node:path';

export const repoRoot = path.resolve(import.meta.dirname, '../..');

/** A TCP port on 127.0.0.1 that was free a moment ago (the OS picks it). */
export function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const s = net.createServer();
    s.once('error', reject);
    s.listen(0, '127.0.0.1', () => {
      const { port } = s.address() as net.AddressInfo;
      s.close(() => resolve(port));
    });
  });
}

/** Builds the client into dist/ (and the server-render entry into dist-ssr/) with Vite when there is no build yet. */
export function buildClientIfMissing(): void {
  if (fs.existsSync(path.join(repoRoot, 'dist/index.html')) && fs.existsSync(path.join(repoRoot, 'dist-ssr/entry-server.js'))) return;
  console.log('building the client (vite build) …');
  const b = spawnSync(process.execPath, ['node_modules/vite/bin/vite.js', 'build', '--logLevel', 'warn'], { cwd: repoRoot, stdio: 'inherit' });
  if (b.status !== 0) throw new Error('vite build failed');
}

export type ServerProcess = { child: ChildProcess; log: string[] };

/**
 * Runs a TypeScript entry point (`server/index.ts`, `fakes/stripe/main.ts`) from the repository root
 * with the given environment, its stdout and stderr kept in `log`. `node --import tsx` runs it in
 * this one process (the tsx CLI would put it in a child that a SIGKILL of the parent leaves running).
 */
export function startTsProcess(script: string, env: NodeJS.ProcessEnv, log: string[] = []): ServerProcess {
  const child = spawn(process.execPath, ['--import', 'tsx', script], { cwd: repoRoot, env, stdio: ['ignore', 'pipe', 'pipe'] });
  child.stdout!.on('data', (d: Buffer) => log.push(d.toString()));
  child.stderr!.on('data', (d: Buffer) => log.push(d.toString()));
  return { child, log };
}

/**
 * Resolves once `url` answers as `ready` says (default: a 2xx). Fails when the time runs out or, given
 * a process, when that process exits first; the process's output goes into the message.
 */
export async function waitUntilUp(url: string, opts: { server?: ServerProcess; ms?: number; ready?: (res: Response) => boolean } = {}): Promise<void> {
  const { server, ms = 120_000, ready = (res) => res.ok } = opts;
  const output = () => (server ? `:\n${server.log.join('')}` : '');
  const until = Date.now() + ms;
  for (;;) {
    if (server && server.child.exitCode !== null) throw new Error(`the server exited during start-up${output()}`);
    try {
      if (ready(await fetch(url))) return;
    } catch {
      /* not up yet */
    }
    if (Date.now() > until) throw new Error(`${url} did not come up within ${ms} ms${output()}`);
    await new Promise((r) => setTimeout(r, 200));
  }
}

/** Resolves once the process has exited (at once when it already has). */
export function exited(child: ChildProcess): Promise<void> {
  return new Promise((r) => (child.exitCode !== null || child.signalCode !== null ? r() : child.once('exit', () => r())));
}

/** Sends `signal` to a process that is still running and waits for it to exit. */
export async function stopProcess(child: ChildProcess, signal: NodeJS.Signals = 'SIGTERM'): Promise<void> {
  if (child.exitCode === null && child.signalCode === null) child.kill(signal);
  await exited(child);
}

/**
 * Starts the built app (`server/index.ts` serving dist/, built first when missing) as a process of
 * its own on a free port with `dataDir`, its mail and payment fakes on ports the OS picks and no
 * request log; `env` adds the run's own settings. Answers at once: wait with `waitUntilUp`.
 */
export async function startBuiltApp(dataDir: string, env: NodeJS.ProcessEnv = {}): Promise<{ server: ServerProcess; base: string }> {
  buildClientIfMissing();
  const port = await freePort();
  const base = `http://localhost:${port}`;
  const server = startTsProcess('server/index.ts', {
    ...process.env,
    DATA_DIR: dataDir,
    PORT: String(port),
    BASE_URL: base,
    CLIENT_DIR: path.join(repoRoot, 'dist'),
    SMTP_PORT: '0',
    STRIPE_FAKE_PORT: '0',
    LOG_REQUESTS: 'false',
    ...env,
  });
  return { server, base };
}
