// Public module of the business feature: its routes, and the sellers' morning digest the scheduler runs.
export { businessRouter } from './business.routes.ts';
export { type DigestDeps, type DigestResult, runDigest } from './digest.ts';
