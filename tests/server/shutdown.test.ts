// Graceful shutdown: the real server (`tsx server/index.ts`, as `npm start` runs it) gets SIGTERM
// while an upload is half sent; the upload still completes (201), new connections are refused,
// the process exits 0, and the database was closed cleanly — its WAL checkpointed, so no -wal
// file is left with frames in it (sqlite.org, "Write-Ahead Logging": the last connection to close
// checkpoints and deletes the WAL).

import { type ChildProcess, spawn } from 'node:child_process';
import fs from 'node:fs';
import http from 'node:http';
import os from 'node:os';
import path from 'node:path';
import Database from 'better-sqlite3';
import sharp from 'sharp';
import { afterAll, describe, expect, test } from 'vitest';
import { offlineServerEnv } from '../factories/offline-env.ts';

const dataDir = fs.mkdtempSync(path.join(os.tmpdir(), 'namesake-shutdown-'));
let child: ChildProcess | null = null;
afterAll(() => {
  if (child && child.exitCode === null) child.kill('SIGKILL');
  fs.rmSync(dataDir, { recursive: true, force: true });
});

function start(): Promise<{ url: string; proc: ChildProcess; output: () => string }> {
  const proc = spawn(path.resolve('node_modules/.bin/tsx'), ['server/index.ts'], {
    env: {
      ...process.env,
      ...offlineServerEnv(dataDir),
      CLIENT_DIR: path.join(dataDir, 'no-client'),
    },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  child = proc;
  let out = '';
  proc.stdout!.on('data', (d) => (out += d));
  proc.stderr!.on('data', (d) => (out += d));
  return new Promise((resolve, reject) => {
    const timer = setTimeout(() => reject(new Error(`server did not start:\n${out}`)), 60_000);
    const look = () => {
      const m = /Namesake is running at (http:\/\/\S+)/.exec(out);
      if (m) {
        clearTimeout(timer);
        resolve({ url: m[1]!.replace('localhost', '127.0.0.1'), proc, output: () => out });
      }
    };
    proc.stdout!.on('data', look);
    proc.on('close', (code) => reject(new Error(`server exited ${code} before starting:\n${out}`)));
  });
}

describe('graceful shutdown', () => {
  test('when SIGTERM arrives during an upload, then the upload completes, the process exits 0 and the WAL is checkpointed', async () => {
    const { url, proc, output } = await start();
    const u = new URL(url);
    const signIn = await fetch(`${url}/api/auth/sign-in/email`, {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify({ email: 'fern@namesake.test', password: 'namesake-demo' }),
    });
    expect(signIn.status).toBe(200);
    const cookie = signIn.headers
      .getSetCookie()
      .map((c) => c.split(';')[0])
      .join('; ');

    // a multipart upload, sent in two halves with SIGTERM in between
    const image = await sharp({ create: { width: 1600, height: 1200, channels: 3 as const, background: '#808080', noise: { type: 'gaussian' as const, mean: 128, sigma: 60 } } })
      .png()
      .toBuffer();
    const boundary = 'namesakeboundary';
    const body = Buffer.concat([
      Buffer.from(`--${boundary}\r\nContent-Disposition: form-data; name="file"; filename="big.png"\r\nContent-Type: image/png\r\n\r\n`),
      image,
      Buffer.from(`\r\n--${boundary}--\r\n`),
    ]);
    const response = new Promise<{ status: number; body: string }>((resolve, reject) => {
      const req = http.request(
        { host: u.hostname, port: u.port, method: 'POST', path: '/api/uploads', headers: { cookie, 'content-type': `multipart/form-data; boundary=${boundary}`, 'content-length': body.length } },
        (res) => {
          let text = '';
          res.on('data', (d) => (text += d));
          res.on('end', () => resolve({ status: res.statusCode ?? 0, body: text }));
        },
      );
      req.on('error', reject);
      const half = Math.floor(body.length / 2);
      req.write(body.subarray(0, half), () => {
        // Act: the signal lands while the request is in flight
        setTimeout(() => {
          proc.kill('SIGTERM');
          setTimeout(() => req.end(body.subarray(half)), 400);
        }, 100);
      });
    });
    const exited = new Promise<number | null>((resolve) => proc.on('exit', (code) => resolve(code)));

    const res = await response;
    const answeredAt = Date.now();
    expect(res.status, res.body).toBe(201);
    expect(JSON.parse(res.body).upload.url).toMatch(/^\/uploads\/[a-f0-9]{32}\.webp$/);
    // once closing, it takes no new connections
    await expect(fetch(`${url}/api/health`)).rejects.toThrow();
    expect(await exited).toBe(0);
    // it closed the now-idle keep-alive connection itself, not by the 5 s cut-off in server/runtime.ts
    expect(Date.now() - answeredAt).toBeLessThan(4000);
    expect(output()).toMatch(/SIGTERM: finishing requests and closing/);

    // the database was closed cleanly: the WAL is gone (or empty), the pid file removed, the upload's row kept
    const wal = path.join(dataDir, 'namesake.db-wal');
    expect(!fs.existsSync(wal) || fs.statSync(wal).size === 0).toBe(true);
    expect(fs.existsSync(path.join(dataDir, 'namesake.pid'))).toBe(false);
    const db = new Database(path.join(dataDir, 'namesake.db'), { readonly: true });
    const id = JSON.parse(res.body).upload.id;
    expect(db.prepare('select id from uploads where id = ?').get(id)).toBeTruthy();
    db.close();
  }, 120_000);
});
