// Public module of the listing-images feature: a live listing's design on its blank as PNG/WebP.
export { listingImagesRouter } from './listing-images.routes.ts';
export { LISTING_IMAGE, listingImage, rasterise } from './listing-images.service.ts';
