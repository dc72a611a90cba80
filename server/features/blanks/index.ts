// Public module of the blanks feature: its routes, a listing's offer resolved for shoppers, and the
// stock holds checkout and payments take, sell and give back.
export { blanksRouter } from './blanks.routes.ts';
export { checkOffer, createType, type HoldItem, holdStock, releaseHolds, resolveOffer, sellHolds, setStock } from './blanks.service.ts';
