// `npm run dev`: Vite with HMR on 5173 (proxying /api) plus the API server in watch mode on 3000.
import { spawn } from 'node:child_process';

const apiPort = process.env.PORT ?? '3000';
const env = { ...process.env, PORT: apiPort, API_PORT: apiPort, BASE_URL: process.env.BASE_URL ?? 'http://localhost:5173' };
const children = [
  spawn(process.execPath, ['node_modules/tsx/dist/cli.mjs', 'watch', '--clear-screen=false', 'server/index.ts'], { stdio: 'inherit', env: { ...env, CLIENT_DIR: '/nonexistent' } }),
  spawn(process.execPath, ['node_modules/vite/bin/vite.js'], { stdio: 'inherit', env }),
];
const stop = (sig) => children.forEach((c) => c.kill(sig));
process.on('SIGINT', () => stop('SIGINT'));
process.on('SIGTERM', () => stop('SIGTERM'));
let left = children.length;
children.forEach((c) =>
  c.on('exit', () => {
    if (--left === 0) process.exit(0);
    else stop('SIGTERM');
  }),
);
