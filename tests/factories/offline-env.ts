// The environment for a real Namesake server (or one of its scripts) that a test starts on its own
// data folder and keeps off the network: ports the OS picks, no payment provider (its API base is a
// closed port, so payment calls fail fast instead of reaching anything), no request log, no digest.

export function offlineServerEnv(dataDir: string): Record<string, string> {
  return {
    NODE_ENV: 'test',
    DATA_DIR: dataDir,
    PORT: '0',
    SMTP_PORT: '0',
    STRIPE_FAKE: 'false',
    STRIPE_API_BASE: 'http://127.0.0.1:9',
    LOG_REQUESTS: 'false',
    DIGEST: 'false',
    BASE_URL: 'http://localhost:3000',
  };
}
