import { PageHeading } from '../../../components/ui/card.tsx';
import { DeliverySettings } from '../../../features/offers/components/delivery-settings.tsx';
import { DiscountCodes } from '../../../features/offers/components/discount-codes.tsx';

/** /workroom/offers — the shop's discount codes, days in the post and order-by dates. */
export function OffersPage() {
  return (
    <div className="flex flex-col gap-8">
      <PageHeading title="Codes and dates" lead="Discount codes for your shop, and the dates shoppers see before they order." />
      <DiscountCodes />
      <DeliverySettings />
    </div>
  );
}
