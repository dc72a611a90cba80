// Public module of the catalog feature: its routes; a listing's public page (moderation reviews the
// page a shopper would see); the search (the catalogue benchmark times it); the live listing and shop
// by slug and their rating summaries (the reviews feature pages their reviews).

export { liveListingBySlug, liveShopBySlug } from './catalog.repo.ts';
export { catalogRouter, catalogSearchRouter } from './catalog.routes.ts';
export { listingPage, listingRating, publicShop, search, shopRating } from './catalog.service.ts';
