// Public module of the shop offers: discount codes, needed-by dates, order-by dates. The cart runs
// `withOffers` after line pricing; checkout freezes and reserves; payments confirms or releases.
export { type DiscountCodeRow, offersRepo } from './offers.repo.ts';
export { publicOffersRouter, sellerOffersRouter } from './offers.routes.ts';
export { assertCodesApply, confirmUses, frozenOffers, releaseUses, removeCartCode, reserveUses, setCartCode, setNeededBy, withOffers } from './offers.service.ts';
