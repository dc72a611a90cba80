// Public module of the reviews feature: its routes.
export { reviewsRouters } from './reviews.routes.ts';
export { create as writeReview, reply as replyToReview } from './reviews.service.ts';
