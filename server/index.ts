// Reads env, migrates, seeds the demo when asked (DEMO_DATA), starts the local fakes, listens; stops cleanly on SIGTERM/Ctrl-C.
// A bad or incomplete environment stops it with exit code 1 and one line per problem.
// WORKERS=N (N > 1) runs N server processes with node:cluster (server/cluster.ts): this file is the
// primary's entry and each worker's too.
import cluster from 'node:cluster';
import path from 'node:path';
import { reportReady, startCluster } from './cluster.ts';
import { DEMO_PASSWORD } from './db/demo-accounts.ts';
import { loadEnv } from './env.ts';
import { startNamesake } from './runtime.ts';

const clientDir = path.resolve(process.env.CLIENT_DIR ?? 'dist');
if (cluster.isWorker) await runWorker();
else await runPrimary();

/** One of the WORKERS processes: serves until told to stop (or until its primary is gone). */
async function runWorker() {
  try {
    const running = await startNamesake({ clientDir, clusterWorker: true });
    let stopping = false;
    const stop = async () => {
      if (stopping) return;
      stopping = true;
      await running.stop();
      process.exit(0);
    };
    process.on('SIGTERM', () => void stop());
    // Ctrl-C reaches the whole process group: the primary sends SIGTERM in turn
    process.on('SIGINT', () => {});
    process.on('disconnect', () => void stop());
    reportReady(running.url);
  } catch (err) {
    console.error(err instanceof Error ? err.message : err);
    process.exit(1);
  }
}

async function runPrimary() {
  try {
    let workers = 1;
    try {
      workers = loadEnv(process.env).WORKERS;
    } catch {
      /* startNamesake reports the environment's problems */
    }
    const running = workers > 1 ? await startCluster(workers, { clientDir }) : await startNamesake({ clientDir });
    const publicUrl = running.env.baseUrl !== running.url ? ` (public address ${running.env.baseUrl})` : '';
    console.log(`\nNamesake is running at ${running.url}${publicUrl}`);
    if (running.demo) {
      console.log(`\nDemo sign-ins (password: ${DEMO_PASSWORD}):`);
      console.log('  shopper  dana@namesake.test');
      console.log('  seller   fern@namesake.test   (Fern & Fable Goods)');
      console.log('  seller   comet@namesake.test  (Little Comet Print Co.)');
      console.log('  admin    admin@namesake.test');
    } else if (running.noAccounts) {
      console.log('\nNo accounts yet. Make the first administrator with:  npm run admin:create -- you@example.com');
    }
    console.log('\nPress Ctrl-C to stop.');
    let stopping = false;
    const stop = async (signal: string) => {
      if (stopping) return;
      stopping = true;
      console.log(`\n${signal}: finishing requests and closing …`);
      await running.stop();
      // 0 for a requested stop; 1 when the cluster gave up on a worker that kept dying (server/cluster.ts)
      process.exit(process.exitCode ?? 0);
    };
    process.on('SIGINT', () => void stop('SIGINT'));
    process.on('SIGTERM', () => void stop('SIGTERM'));
  } catch (err) {
    console.error(err instanceof Error ? err.message : err);
    process.exit(1);
  }
}
