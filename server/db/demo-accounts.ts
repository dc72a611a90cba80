// The demo scenario's accounts (DEVELOPERS.md, "Demo scenario"): made by the seed (seed.ts) and
// listed on the sign-in page (GET /api/config) only while they are really in the database. Apart from
// the seed so that the app can ask without loading the seeding code.
import type { Db } from './client.ts';
import { seedRepo } from './seed.repo.ts';

export const DEMO_PASSWORD = 'namesake-demo';

export const DEMO_ACCOUNTS = [
  { email: 'dana@namesake.test', name: 'Dana Whitlock', role: 'shopper' },
  { email: 'fern@namesake.test', name: 'Fern Okafor', role: 'seller' },
  { email: 'comet@namesake.test', name: 'Cass Merriweather', role: 'seller' },
  { email: 'harbour@namesake.test', name: 'Hal Brennan', role: 'seller' },
  { email: 'admin@namesake.test', name: 'Ada Moderator', role: 'admin' },
] as const;

/** Whether the demo accounts are in the database (the sign-in page lists them only then). */
export function hasDemoData(deps: { db: Db }): boolean {
  const emails = DEMO_ACCOUNTS.map((a) => a.email);
  return seedRepo.usersWithEmails(deps.db, emails) === emails.length;
}
