// Public module of the catalog feature: its routes; a listing's public page (moderation reviews the
// page a shopper would see); the search (the catalogue benchmark times it).
export { catalogRouter, catalogSearchRouter } from './catalog.routes.ts';
export { listingPage, publicShop, search } from './catalog.service.ts';
