// Public module of the blanks feature: its routes, a listing's offer resolved for shoppers, and the
// stock holds checkout and payments take, sell and give back.
export { blanksRouter } from './blanks.routes.ts';
export { checkOffer, type HoldItem, holdStock, releaseHolds, resolveOffer, sellHolds } from './blanks.service.ts';
