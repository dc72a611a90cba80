// DATA_DIR/namesake.pid: written by a running server (server/runtime.ts), removed when it stops,
// so tools that must not run beside it (scripts/db-restore.ts) can tell.
import fs from 'node:fs';
import path from 'node:path';

export const PID_FILE = 'namesake.pid';

export function writePidFile(dataDir: string): () => void {
  const file = path.join(dataDir, PID_FILE);
  fs.writeFileSync(file, `${process.pid}\n`);
  return () => {
    try {
      if (fs.readFileSync(file, 'utf8').trim() === String(process.pid)) fs.rmSync(file, { force: true });
    } catch {
      /* already gone */
    }
  };
}

/** The pid of a live server on this DATA_DIR, or null (no file, or a stale one left by a crash). */
export function runningPid(dataDir: string): number | null {
  let pid: number;
  try {
    pid = Number(fs.readFileSync(path.join(dataDir, PID_FILE), 'utf8').trim());
  } catch {
    return null;
  }
  if (!Number.isInteger(pid) || pid <= 0) return null;
  try {
    process.kill(pid, 0);
    return pid;
  } catch (err) {
    // EPERM: it exists but belongs to someone else — still running
    return (err as NodeJS.ErrnoException).code === 'EPERM' ? pid : null;
  }
}
