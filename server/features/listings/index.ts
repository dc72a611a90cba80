// Public module of the listings feature: its routes.
export { listingsRouter } from './listings.routes.ts';
