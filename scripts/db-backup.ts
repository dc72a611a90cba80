// `npm run db:backup [FILE]`: a consistent copy of DATA_DIR's database while the app keeps running.
// SQLite's online backup API (better-sqlite3 `db.backup`) copies pages step by step and restarts
// a step when a writer changes a page it already copied, so the copy is one point in time even
// with writes going on (sqlite.org, "SQLite Online Backup API"). Default file:
// DATA_DIR/backups/namesake-<timestamp>.db. The copy is checked (integrity_check) before we say so.
import fs from 'node:fs';
import path from 'node:path';
import { pathToFileURL } from 'node:url';
import Database from 'better-sqlite3';
import { loadEnv } from '../server/env.ts';

export function defaultBackupFile(dataDir: string, now = new Date()): string {
  const stamp = now.toISOString().replace(/[:.]/g, '-');
  return path.join(dataDir, 'backups', `namesake-${stamp}.db`);
}

export async function backupDatabase(dbFile: string, outFile: string): Promise<{ file: string; bytes: number; pages: number }> {
  if (!fs.existsSync(dbFile)) throw new Error(`There is no database at ${dbFile}.`);
  if (fs.existsSync(outFile)) throw new Error(`${outFile} already exists; choose another file.`);
  fs.mkdirSync(path.dirname(outFile), { recursive: true });
  const db = new Database(dbFile, { fileMustExist: true });
  db.pragma('busy_timeout = 5000');
  let pages = 0;
  try {
    const tmp = `${outFile}.partial`;
    fs.rmSync(tmp, { force: true });
    // 256 pages a step keeps each read lock short, so the app's writers are barely held up
    // one step for the whole file: a step holds a read transaction, so writers on other connections
    // (WAL) carry on and cannot restart the copy half-way, however busy the shop is
    await db.backup(tmp, { progress: ({ totalPages }) => ((pages = totalPages), Math.max(totalPages, 1) * 2) });
    const copy = new Database(tmp);
    try {
      const check = copy.pragma('integrity_check', { simple: true });
      if (check !== 'ok') throw new Error(`The copy failed its integrity check: ${String(check)}`);
      // a backup is a single file: leave it in rollback-journal mode so it carries no -wal
      copy.pragma('journal_mode = DELETE');
    } finally {
      copy.close();
    }
    fs.renameSync(tmp, outFile);
  } finally {
    db.close();
  }
  return { file: outFile, bytes: fs.statSync(outFile).size, pages };
}

if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) {
  try {
    const env = loadEnv();
    const out = path.resolve(process.argv[2] ?? defaultBackupFile(env.dataDir));
    const r = await backupDatabase(env.dbFile, out);
    console.log(`backed up ${env.dbFile} → ${r.file} (${(r.bytes / 1024).toFixed(0)} kB, ${r.pages} pages, integrity ok)`);
  } catch (err) {
    console.error(`db:backup: ${err instanceof Error ? err.message : String(err)}`);
    process.exit(1);
  }
}
