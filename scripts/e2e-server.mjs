// Starts the built app for Playwright: a throw-away DATA_DIR, demo data, fakes on free ports.
import { spawn } from 'node:child_process';
import fs from 'node:fs';

const dataDir = process.env.E2E_DATA_DIR;
fs.rmSync(dataDir, { recursive: true, force: true });
fs.mkdirSync(dataDir, { recursive: true });
const child = spawn(process.execPath, ['node_modules/tsx/dist/cli.mjs', 'server/index.ts'], {
  stdio: 'inherit',
  env: {
    ...process.env,
    DATA_DIR: dataDir,
    PORT: process.env.E2E_PORT,
    BASE_URL: `http://localhost:${process.env.E2E_PORT}`,
    SMTP_PORT: '0',
    STRIPE_FAKE_PORT: '0',
    LOG_REQUESTS: 'false',
    DEMO_DATA: 'true',
    AUTH_IP_RATE_LIMIT: 'false',
  },
});
for (const sig of ['SIGINT', 'SIGTERM']) process.on(sig, () => child.kill(sig));
child.on('exit', (code) => process.exit(code ?? 0));
