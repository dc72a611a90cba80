// Reads env, migrates, seeds when empty, starts the local fakes, listens; stops cleanly on SIGTERM/Ctrl-C.
import path from 'node:path';
import { startNamesake } from './runtime.ts';

const clientDir = path.resolve(process.env.CLIENT_DIR ?? 'dist');
try {
  const running = await startNamesake({ clientDir });
  console.log(`\nNamesake is running at ${running.url}`);
  if (running.env.demoMode) {
    console.log('\nDemo sign-ins (password: namesake-demo):');
    console.log('  shopper  dana@namesake.test');
    console.log('  seller   fern@namesake.test   (Fern & Fable Goods)');
    console.log('  seller   comet@namesake.test  (Little Comet Print Co.)');
    console.log('  admin    admin@namesake.test');
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
