// `npm run db:restore FILE`: puts a backup in place of DATA_DIR's database. Refuses unless FILE is
// a sound Namesake database (integrity_check + our tables + migration history), and refuses while
// a Namesake server runs on DATA_DIR (server/runtime.ts keeps DATA_DIR/namesake.pid while it
// runs). The old database is kept beside it as namesake.db.before-restore-<timestamp>.
import fs from 'node:fs';
import path from 'node:path';
import { pathToFileURL } from 'node:url';
import Database from 'better-sqlite3';
import { loadEnv } from '../server/env.ts';
import { PID_FILE, runningPid } from '../server/runtime-lock.ts';

/** Tables every Namesake database has (server/db/schema.ts, server/db/auth-schema.ts, drizzle's journal). */
export const REQUIRED_TABLES = ['user', 'account', 'session', 'shops', 'materials', 'motifs', 'listings', 'carts', 'checkouts', 'orders', 'order_lines', 'ledger', '__drizzle_migrations'];

export function checkNamesakeDb(file: string): void {
  if (!fs.existsSync(file)) throw new Error(`${file} does not exist.`);
  let db: Database.Database;
  try {
    db = new Database(file, { readonly: true, fileMustExist: true });
  } catch {
    throw new Error(`${file} is not a SQLite database.`);
  }
  try {
    let check: unknown;
    try {
      check = db.pragma('integrity_check', { simple: true });
    } catch {
      throw new Error(`${file} is not a SQLite database.`);
    }
    if (check !== 'ok') throw new Error(`${file} failed its integrity check: ${String(check)}`);
    const have = new Set((db.prepare("select name from sqlite_master where type = 'table'").all() as { name: string }[]).map((r) => r.name));
    const missing = REQUIRED_TABLES.filter((t) => !have.has(t));
    if (missing.length) throw new Error(`${file} is not a Namesake database (missing tables: ${missing.join(', ')}).`);
  } finally {
    db.close();
  }
}

export function restoreDatabase(opts: { dataDir: string; dbFile: string; from: string; now?: Date }): { keptAs: string | null } {
  const from = path.resolve(opts.from);
  checkNamesakeDb(from);
  const pid = runningPid(opts.dataDir);
  if (pid) throw new Error(`A Namesake server (pid ${pid}) is running on ${opts.dataDir}. Stop it first, then restore.`);
  if (path.resolve(opts.dbFile) === from) throw new Error('That file is the live database itself.');
  fs.mkdirSync(path.dirname(opts.dbFile), { recursive: true });
  let keptAs: string | null = null;
  if (fs.existsSync(opts.dbFile)) {
    // fold the old database's WAL into its main file, so the file we keep is complete on its own
    const old = new Database(opts.dbFile);
    old.pragma('wal_checkpoint(TRUNCATE)');
    old.pragma('journal_mode = DELETE');
    old.close();
    keptAs = `${opts.dbFile}.before-restore-${(opts.now ?? new Date()).toISOString().replace(/[:.]/g, '-')}`;
    fs.renameSync(opts.dbFile, keptAs);
  }
  for (const ext of ['-wal', '-shm']) fs.rmSync(opts.dbFile + ext, { force: true });
  const tmp = `${opts.dbFile}.restoring`;
  fs.copyFileSync(from, tmp);
  const fd = fs.openSync(tmp, 'r+');
  fs.fsyncSync(fd);
  fs.closeSync(fd);
  fs.renameSync(tmp, opts.dbFile);
  return { keptAs };
}

if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) {
  try {
    const from = process.argv[2];
    if (!from) throw new Error('Name the backup file: npm run db:restore -- data/backups/namesake-….db');
    const env = loadEnv();
    const r = restoreDatabase({ dataDir: env.dataDir, dbFile: env.dbFile, from });
    console.log(`restored ${path.resolve(from)} → ${env.dbFile}${r.keptAs ? ` (the old database is kept as ${r.keptAs})` : ''}`);
    console.log(`(while a server runs, ${PID_FILE} in DATA_DIR makes this refuse)`);
  } catch (err) {
    console.error(`db:restore: ${err instanceof Error ? err.message : String(err)}`);
    process.exit(1);
  }
}
