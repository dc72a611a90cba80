// `npm run db:seed`: seeds the demo scenario into an empty database (start-up does this too). The
// demo orders are paid at the local payment fake, so it runs here (on a free port, its state in
// DATA_DIR/stripe, where the server's own fake finds it at the next start).
import path from 'node:path';
import { startStripeFake } from '../fakes/stripe/server.ts';
import { createApp } from '../server/app.ts';
import { openDb } from '../server/db/client.ts';
import { isEmpty, seedDemo } from '../server/db/seed.ts';
import { loadEnv } from '../server/env.ts';
import { createMailer } from '../server/integrations/mailer.ts';

let env = loadEnv();
if (!env.demoData) {
  console.error('db:seed: demo data is off (production): set DEMO_DATA=true to seed the demo scenario, never on a real shop (its passwords are public).');
  process.exit(1);
}
const fake = env.startStripeFake ? await startStripeFake({ port: 0, dataDir: path.join(env.dataDir, 'stripe'), webhookSecret: env.STRIPE_WEBHOOK_SECRET }) : null;
if (fake) env = { ...env, STRIPE_API_BASE: fake.url };
const { db, sqlite } = openDb(env.dbFile);
const mailer = createMailer(env);
const app = createApp({ db, env, mailer });
try {
  if (isEmpty({ db })) {
    await seedDemo(app.locals.deps);
    console.log(`seeded the demo scenario into ${env.dbFile}`);
  } else {
    console.log(`${env.dbFile} already has data; nothing seeded (delete DATA_DIR to start over)`);
  }
} finally {
  mailer.close();
  await fake?.close();
  sqlite.close();
}
