// `npm run db:migrate`: applies drizzle/ migrations to DATA_DIR's database (start-up does this too).

import { openDb } from '../server/db/client.ts';
import { loadEnv } from '../server/env.ts';

const env = loadEnv();
const { sqlite } = openDb(env.dbFile);
sqlite.close();
console.log(`migrated ${env.dbFile}`);
