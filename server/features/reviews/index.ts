// Public module of the reviews feature: its routes.
export { reviewsRouters } from './reviews.routes.ts';
