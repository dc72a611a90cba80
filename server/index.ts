// Reads env, migrates, seeds the demo when asked (DEMO_DATA), starts the local fakes, listens; stops cleanly on SIGTERM/Ctrl-C.
// A bad or incomplete environment stops it with exit code 1 and one line per problem.
import path from 'node:path';
import { DEMO_PASSWORD } from './db/demo-accounts.ts';
import { startNamesake } from './runtime.ts';

const clientDir = path.resolve(process.env.CLIENT_DIR ?? 'dist');
try {
  const running = await startNamesake({ clientDir });
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
    process.exit(0);
  };
  process.on('SIGINT', () => void stop('SIGINT'));
  process.on('SIGTERM', () => void stop('SIGTERM'));
} catch (err) {
  console.error(err instanceof Error ? err.message : err);
  process.exit(1);
}
