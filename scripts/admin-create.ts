// `npm run admin:create -- EMAIL`: the first administrator of a real installation (and any later one).
// Makes the account — or promotes an existing one — with role admin and no password anybody knows,
// then prints a one-time link to choose the password: better-auth's own reset-password token, the very
// link the "Reset your password" e-mail carries, on BASE_URL, valid for an hour. Run it with the
// same environment as the server (DATA_DIR, BASE_URL, …); it may run while the server runs.
import { eq } from 'drizzle-orm';
import { createAuth } from '../server/auth.ts';
import { openDb } from '../server/db/client.ts';
import { user } from '../server/db/schema.ts';
import { loadEnv } from '../server/env.ts';
import type { Mail, Mailer } from '../server/integrations/mailer.ts';
import { emailSchema } from '../shared/schemas/auth.ts';

/** The client's page that takes the token (the same redirect the app's "forgot password" form asks for). */
const RESET_PAGE = '/reset-password';

function fail(message: string): never {
  console.error(`admin:create: ${message}`);
  process.exit(1);
}

const args = process.argv.slice(2).filter((a) => a !== '--');
if (args.length !== 1) fail('give exactly one e-mail address: npm run admin:create -- you@example.com');
const parsedEmail = emailSchema.safeParse(args[0]);
if (!parsedEmail.success) fail(`"${args[0]}" is not an e-mail address we can use: ${parsedEmail.error.issues[0]?.message ?? 'invalid'}`);
const email = parsedEmail.data.toLowerCase();

let env: ReturnType<typeof loadEnv>;
try {
  env = loadEnv();
} catch (err) {
  fail(err instanceof Error ? err.message : String(err));
}

const { db, sqlite } = openDb(env.dbFile);
// the reset e-mail is not sent: we take its link and print it here
const sent: Mail[] = [];
const keep: Mailer = { send: async (m) => void sent.push(m), close: () => {} };
const auth = createAuth({ db, env, mailer: keep });
try {
  const found = db.select({ role: user.role }).from(user).where(eq(user.email, email)).get();
  let what: string;
  if (found) {
    what = found.role === 'admin' ? 'already an administrator' : `promoted from ${found.role ?? 'shopper'} to administrator`;
    db.update(user).set({ role: 'admin' }).where(eq(user.email, email)).run();
  } else {
    // the admin plugin's own create, without a password: no credential account exists until the link is used
    await auth.api.createUser({ body: { email, name: 'Administrator', role: 'admin', data: { emailVerified: true } } });
    what = 'new account, no password yet';
  }
  const banned = db.select({ banned: user.banned }).from(user).where(eq(user.email, email)).get()?.banned;

  await auth.api.requestPasswordReset({ body: { email, redirectTo: RESET_PAGE } });
  const link = sent.flatMap((m) => m.text.match(/https?:\/\/\S+\/reset-password\/\S+/) ?? [])[0];
  if (!link) fail('better-auth made no reset link; nothing else was changed but the role');

  console.log(`Administrator: ${email} (${what})`);
  if (banned) console.log('Note: this account is banned; lift the ban on the moderation desk or it cannot sign in.');
  console.log(`\nOpen this link within an hour to choose the password${found ? ' (or ignore it to keep the current one)' : ''}:\n\n  ${link}\n`);
  console.log('It works once. If it runs out, run this command again for a new one.');
} finally {
  sqlite.close();
}
