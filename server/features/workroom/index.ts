// Public module of the workroom feature: its routes, and proof approval for the demo seed.

export { approve } from './proofs.service.ts';
export { ship } from './shipping.service.ts';
export { proofEditRouter, workroomRouter } from './workroom.routes.ts';
export { createWorksheetBuilder, type WorksheetBuilder } from './worksheet-jobs.ts';
