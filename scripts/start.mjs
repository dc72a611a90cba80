// `npm start`: build the client when dist/ is missing or older than its sources, then run the
// server (migrations, demo seed, local fakes) and pass Ctrl-C / SIGTERM on so everything stops cleanly.
import { spawn, spawnSync } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';

const root = path.resolve(path.dirname(new URL(import.meta.url).pathname), '..');
process.chdir(root);

function newest(p) {
  if (!fs.existsSync(p)) return 0;
  const st = fs.statSync(p);
  if (!st.isDirectory()) return st.mtimeMs;
  let max = st.mtimeMs;
  for (const e of fs.readdirSync(p)) max = Math.max(max, newest(path.join(p, e)));
  return max;
}

// `vite build` makes both the client (dist/) and the server-render entry (dist-ssr/)
const built = fs.existsSync('dist/index.html') && fs.existsSync('dist-ssr/entry-server.js') ? fs.statSync('dist/index.html').mtimeMs : 0;
const sources = Math.max(...['src', 'shared', 'public', 'index.html', 'vite.config.ts', 'package-lock.json'].map(newest));
if (built < sources) {
  console.log(built ? 'The client is older than its sources: building …' : 'Building the client (first start) …');
  const r = spawnSync(process.execPath, ['node_modules/vite/bin/vite.js', 'build', '--logLevel', 'warn'], { stdio: 'inherit' });
  if (r.status !== 0) process.exit(r.status ?? 1);
}

const child = spawn(process.execPath, ['node_modules/tsx/dist/cli.mjs', 'server/index.ts'], { stdio: 'inherit', env: process.env });
for (const sig of ['SIGINT', 'SIGTERM']) process.on(sig, () => child.kill(sig));
child.on('exit', (code, signal) => process.exit(code ?? (signal ? 0 : 1)));
