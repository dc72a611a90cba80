// Runs the mail fake alone: `npm run fakes` starts it with the Stripe fake.
import path from 'node:path';
import { startMailFake } from './server.ts';

const dir = path.join(path.resolve(process.env.DATA_DIR ?? './data'), 'mail');
const fake = await startMailFake({ port: Number(process.env.SMTP_PORT ?? 2525), dir });
console.log(`mail fake: smtp://127.0.0.1:${fake.port} → ${dir}`);
const stop = () => void fake.close().then(() => process.exit(0));
process.on('SIGTERM', stop);
process.on('SIGINT', stop);
