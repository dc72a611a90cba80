import os from 'node:os';
import path from 'node:path';
import { defineConfig, devices } from '@playwright/test';

// one port and data folder per run; scripts/test.mjs and CI use these defaults
const port = Number(process.env.E2E_PORT ?? 4319);
process.env.E2E_PORT = String(port);
process.env.E2E_DATA_DIR ??= path.join(os.tmpdir(), `namesake-e2e-${port}`);
const baseURL = `http://localhost:${port}`;

export default defineConfig({
  testDir: '.',
  fullyParallel: false,
  workers: 1,
  retries: 0,
  timeout: 60_000,
  expect: { timeout: 10_000 },
  reporter: [['list'], ['json']],
  use: {
    baseURL,
    trace: 'off',
    screenshot: 'only-on-failure',
    launchOptions: {
      executablePath: '/usr/bin/chromium',
      args: ['--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'],
    },
  },
  projects: [{ name: 'chromium', use: { ...devices['Desktop Chrome'], channel: undefined } }],
  webServer: {
    command: 'node scripts/e2e-server.mjs',
    cwd: process.cwd(),
    url: `${baseURL}/api/health`,
    reuseExistingServer: false,
    timeout: 120_000,
    stdout: 'ignore',
    stderr: 'pipe',
  },
});
