// The cart feature's public face: what other features may use of it. Anything not exported here
// stays inside server/features/cart.
export { buildSnapshot, readLiveContent, snapshotLookups } from './design.ts';
