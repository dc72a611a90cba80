import { useQueryClient } from '@tanstack/react-query';
import { PageHeading } from '../../../components/ui/card.tsx';
import { Spinner } from '../../../components/ui/button.tsx';
import { authKeys } from '../../../features/auth/api/keys.ts';
import { useOwnShop } from '../../../features/shop-settings/api/get-own-shop.ts';
import { ShopSettingsForm } from '../../../features/shop-settings/components/shop-settings-form.tsx';
import { SellerNav } from './seller-nav.tsx';

export function ShopSettingsPage() {
  const shop = useOwnShop();
  const queryClient = useQueryClient();
  return (
    <div>
      <SellerNav />
      <PageHeading eyebrow="Workroom" title="Shop settings" lead="How your shop appears to shoppers, and what they can expect from you." />
      <div className="max-w-3xl">
        {shop.isPending ? <Spinner label="Loading your shop…" /> : null}
        {shop.isError ? <p role="alert" className="font-semibold text-danger">{shop.error.message}</p> : null}
        {shop.data ? (
          // the header reads the shop's name from /api/me, so refresh it after a save
          <ShopSettingsForm key={shop.data.slug} shop={shop.data} onSaved={() => void queryClient.invalidateQueries({ queryKey: authKeys.me() })} />
        ) : null}
      </div>
    </div>
  );
}

export default ShopSettingsPage;
