// The workroom feature's public face: what code outside server/features/workroom may use of it.
// Anything not exported here stays inside the feature.
export { approve } from './proofs.service.ts';
