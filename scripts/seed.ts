// `npm run db:seed`: seeds the demo scenario into an empty database (start-up does this too).
import { loadEnv } from '../server/env.ts';
import { openDb } from '../server/db/client.ts';
import { createMailer } from '../server/integrations/mailer.ts';
import { createApp } from '../server/app.ts';
import { isEmpty, seedDemo } from '../server/db/seed.ts';

const env = loadEnv();
if (!env.demoData) {
  console.error('db:seed: demo data is off (production): set DEMO_DATA=true to seed the demo scenario, never on a real shop (its passwords are public).');
  process.exit(1);
}
const { db, sqlite } = openDb(env.dbFile);
const mailer = createMailer(env);
const app = createApp({ db, env, mailer });
if (isEmpty({ db })) {
  await seedDemo(app.locals.deps);
  console.log(`seeded the demo scenario into ${env.dbFile}`);
} else {
  console.log(`${env.dbFile} already has data; nothing seeded (delete DATA_DIR to start over)`);
}
mailer.close();
sqlite.close();
