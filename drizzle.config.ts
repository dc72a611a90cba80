import { defineConfig } from 'drizzle-kit';

export default defineConfig({
  dialect: 'sqlite',
  out: './drizzle',
  schema: ['./server/db/schema.ts', './server/db/auth-schema.ts'],
  dbCredentials: { url: process.env.DATABASE_URL ?? './data/namesake.db' },
});
