// WORKERS=2 through the real server (`node --import tsx server/index.ts`, as `npm start` runs it):
// two processes answer on one port and share the SQLite file. Which process served a request is read
// from the operating system (Linux /proc: the server-side socket of our connection, and the process
// holding it), not from anything the app says, so each check below is known to span both processes:
//  - a rate limit (ours, and better-auth's) holds across them: the count does not start again per process;
//  - a work sheet PDF job started on one is polled and downloaded from the other;
//  - the scheduled jobs run in one process only (the lease holder), and move when that process dies.

import { type ChildProcess, execFileSync, spawn } from 'node:child_process';
import fs from 'node:fs';
import http from 'node:http';
import os from 'node:os';
import path from 'node:path';
import Database from 'better-sqlite3';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { listMail } from '../../fakes/mail/store.ts';
import { eventually } from '../factories/app.ts';
import { offlineServerEnv } from '../factories/offline-env.ts';

const dataDir = fs.mkdtempSync(path.join(os.tmpdir(), 'namesake-cluster-'));
let primary: ChildProcess;
let out = '';
let port = 0;

beforeAll(async () => {
  primary = spawn(process.execPath, ['--import', 'tsx', 'server/index.ts'], {
    env: {
      ...process.env,
      ...offlineServerEnv(dataDir),
      CLIENT_DIR: path.join(dataDir, 'no-client'),
      WORKERS: '2',
      // better-auth's per-address limits too (off by default under NODE_ENV=test)
      AUTH_IP_RATE_LIMIT: 'true',
      // the digest's catch-up runs at every start (midnight UTC has passed): a scheduled job to watch
      DIGEST: 'true',
      DIGEST_CRON: '0 0 * * *',
      BUSINESS_TIME_ZONE: 'UTC',
    },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  primary.stdout!.on('data', (d) => (out += d));
  primary.stderr!.on('data', (d) => (out += d));
  const url = await eventually(() => /Namesake is running at (http:\/\/\S+)/.exec(out)?.[1], 150_000);
  port = Number(new URL(String(url)).port);
}, 160_000);

afterAll(() => {
  if (primary && primary.exitCode === null) primary.kill('SIGKILL');
  for (const pid of workerPids()) process.kill(pid, 'SIGKILL');
  fs.rmSync(dataDir, { recursive: true, force: true });
});

function workerPids(): number[] {
  if (!primary?.pid) return [];
  try {
    // the primary's children that run the server (a helper process of the TypeScript loader may be there too)
    return execFileSync('ps', ['-o', 'pid=,args=', '--ppid', String(primary.pid)], { encoding: 'utf8' })
      .split('\n')
      .filter((line) => line.includes('server/index.ts'))
      .map((line) => Number.parseInt(line.trim(), 10))
      .filter((n) => n > 0);
  } catch {
    return []; // no children
  }
}

/** The pid of the process holding the server side of our connection from `clientPort` (Linux /proc). */
function servingPid(clientPort: number): number | null {
  const hex = (n: number) => n.toString(16).toUpperCase().padStart(4, '0');
  let inode: string | null = null;
  for (const file of ['/proc/net/tcp', '/proc/net/tcp6']) {
    for (const line of fs.readFileSync(file, 'utf8').split('\n').slice(1)) {
      const f = line.trim().split(/\s+/);
      if (f.length > 9 && f[1]!.endsWith(`:${hex(port)}`) && f[2]!.endsWith(`:${hex(clientPort)}`)) inode = f[9]!;
    }
  }
  if (!inode) return null;
  for (const pid of workerPids()) {
    for (const fd of fs.readdirSync(`/proc/${pid}/fd`)) {
      try {
        if (fs.readlinkSync(`/proc/${pid}/fd/${fd}`) === `socket:[${inode}]`) return pid;
      } catch {
        /* closed meanwhile */
      }
    }
  }
  return null;
}

type Res = { status: number; body: Buffer; json: () => any; cookies: string[]; pid: number | null };

/** One kept-alive connection to the server: every request on it is served by the same process. */
function connection() {
  const agent = new http.Agent({ keepAlive: true, maxSockets: 1 });
  let cookie = '';
  const send = (method: string, p: string, body?: unknown): Promise<Res> =>
    new Promise((resolve, reject) => {
      const data = body === undefined ? undefined : Buffer.from(JSON.stringify(body));
      const req = http.request(
        {
          agent,
          host: '127.0.0.1',
          port,
          method,
          path: p,
          headers: { origin: 'http://localhost:3000', ...(cookie ? { cookie } : {}), ...(data ? { 'content-type': 'application/json', 'content-length': data.length } : {}) },
        },
        (res) => {
          const pid = servingPid(res.socket.localPort!);
          const chunks: Buffer[] = [];
          res.on('data', (c: Buffer) => chunks.push(c));
          res.on('end', () => {
            const b = Buffer.concat(chunks);
            resolve({ status: res.statusCode!, body: b, json: () => JSON.parse(b.toString()), cookies: res.headers['set-cookie'] ?? [], pid });
          });
        },
      );
      req.on('error', reject);
      req.end(data);
    });
  return {
    send,
    setCookie: (c: string) => (cookie = c),
    close: () => agent.destroy(),
  };
}

/** Two connections served by two different processes. */
async function twoProcesses() {
  for (let tries = 0; tries < 10; tries++) {
    const a = connection();
    const b = connection();
    const pa = (await a.send('GET', '/api/health')).pid;
    const pb = (await b.send('GET', '/api/health')).pid;
    if (pa && pb && pa !== pb) return { a, b, pids: [pa, pb] as const };
    a.close();
    b.close();
  }
  throw new Error('could not reach two different server processes');
}

/** A GET served by a process other than `pid`: fresh connections until one lands elsewhere. */
async function getElsewhere(pid: number | null, p: string, cookie: string): Promise<Res> {
  for (let tries = 0; tries < 10; tries++) {
    const c = connection();
    c.setCookie(cookie);
    try {
      const r = await c.send('GET', p);
      if (r.pid && r.pid !== pid) return r;
    } finally {
      c.close();
    }
  }
  throw new Error(`every try of ${p} was served by process ${pid}`);
}

const holderPid = (): number | null => {
  const db = new Database(path.join(dataDir, 'namesake.db'), { readonly: true });
  try {
    const row = db.prepare('SELECT holder FROM leases WHERE name = ? AND expires_at > ?').get('once-only', Date.now()) as { holder: string } | undefined;
    return row ? Number(/^pid (\d+) /.exec(row.holder)?.[1]) : null;
  } finally {
    db.close();
  }
};
const holderLines = () => [...out.matchAll(/process (\d+) runs the scheduled jobs/g)].map((m) => Number(m[1]));

describe('WORKERS=2', () => {
  test('when started, then two worker processes answer on one port', async () => {
    expect(workerPids()).toHaveLength(2);
    const { a, b, pids } = await twoProcesses();
    expect(workerPids()).toEqual(expect.arrayContaining([...pids]));
    a.close();
    b.close();
  });

  test('when sign-ins fail on alternating processes, then the per-account limit still stops the sixth', async () => {
    const { a, b, pids } = await twoProcesses();
    const statuses: number[] = [];
    const servedBy = new Set<number | null>();
    for (let i = 0; i < 8; i++) {
      const r = await (i % 2 ? b : a).send('POST', '/api/auth/sign-in/email', { email: 'nobody-here@namesake.test', password: 'not-the-password' });
      statuses.push(r.status);
      servedBy.add(r.pid);
    }
    expect([...servedBy].sort()).toEqual([...pids].sort());
    // 5 failures a minute per account (server/app.ts); a count per process would have let 8 through
    expect(statuses).toEqual([401, 401, 401, 401, 401, 429, 429, 429]);
    a.close();
    b.close();
  });

  test("when password resets are asked for on alternating processes, then better-auth's per-address limit holds across them", async () => {
    const { a, b, pids } = await twoProcesses();
    const statuses: number[] = [];
    const servedBy = new Set<number | null>();
    for (let i = 0; i < 7; i++) {
      const r = await (i % 2 ? b : a).send('POST', '/api/auth/request-password-reset', { email: 'dana@namesake.test', redirectTo: '/reset' });
      statuses.push(r.status);
      servedBy.add(r.pid);
    }
    expect([...servedBy].sort()).toEqual([...pids].sort());
    // 5 a minute per address (server/auth.ts)
    expect(statuses.slice(0, 5).every((s) => s === 200)).toBe(true);
    expect(statuses.slice(5)).toEqual([429, 429]);
    a.close();
    b.close();
  });

  test('when a work sheet PDF is started on one process, then the other reports its progress and serves the file', async () => {
    const a = connection();
    const signIn = await a.send('POST', '/api/auth/sign-in/email', { email: 'fern@namesake.test', password: 'namesake-demo' });
    expect(signIn.status).toBe(200);
    const cookie = signIn.cookies.map((c) => c.split(';')[0]).join('; ');
    a.setCookie(cookie);
    const approved = (await a.send('GET', '/api/workroom/lines?state=approved&limit=100')).json().items as Array<{ id: string }>;
    expect(approved.length).toBeGreaterThan(0);
    const built = await a.send('POST', '/api/workroom/cut-sheets', { lineIds: [approved[0]!.id] });
    expect(built.status).toBe(201);
    const started = await a.send('POST', `/api/workroom/batches/${built.json().batchId}/worksheet`, { paper: 'A4' });
    expect(started.status).toBe(202);
    const jobId = started.json().job.id as string;
    const done = await eventually(async () => {
      const r = await getElsewhere(started.pid, `/api/workroom/worksheets/${jobId}`, cookie);
      expect(r.status).toBe(200);
      return r.json().job.state === 'done' ? r.json().job : null;
    }, 60_000);
    expect(done.progress).toBe(1);
    const file = await getElsewhere(started.pid, done.downloadUrl, cookie);
    expect(file.status).toBe(200);
    expect(file.body.subarray(0, 5).toString()).toBe('%PDF-');
    a.close();
  }, 90_000);

  test('when both processes start, then only the lease holder runs the scheduled jobs, and the digest goes out once', async () => {
    const holder = holderPid();
    expect(workerPids()).toContain(holder);
    expect(holderLines()).toEqual([holder]);
    const digests = (await listMail(path.join(dataDir, 'mail'), {})).filter((m) => /your workroom for/.test(m.subject ?? ''));
    const perShop = new Map<string, number>();
    for (const m of digests) perShop.set(String(m.to), (perShop.get(String(m.to)) ?? 0) + 1);
    expect([...perShop.values()].every((n) => n === 1)).toBe(true);
  });

  test('when the lease holder dies, then a live process takes the scheduled jobs over and a new worker replaces it', async () => {
    const holder = holderPid()!;
    process.kill(holder, 'SIGKILL');
    const next = await eventually(() => {
      const h = holderPid();
      return h && h !== holder ? h : null;
    }, 30_000);
    expect(workerPids()).toContain(next);
    await eventually(() => holderLines().length === 2, 10_000);
    expect(holderLines()).toEqual([holder, next]);
    // the primary forks a replacement, so two processes serve again
    await eventually(() => workerPids().length === 2 && !workerPids().includes(holder), 60_000);
  }, 90_000);

  test('when the primary gets SIGTERM, then every process exits, the primary with 0, and the WAL is checkpointed', async () => {
    const workers = workerPids();
    const exit = new Promise<number | null>((r) => primary.once('exit', (code) => r(code)));
    primary.kill('SIGTERM');
    expect(await exit).toBe(0);
    for (const pid of workers) expect(() => process.kill(pid, 0)).toThrow();
    const wal = path.join(dataDir, 'namesake.db-wal');
    expect(!fs.existsSync(wal) || fs.statSync(wal).size === 0).toBe(true);
  }, 60_000);
});
