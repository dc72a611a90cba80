import { useQueryClient } from '@tanstack/react-query';
import { QueryPage } from '../../../components/ui/query-boundary.tsx';
import { authKeys } from '../../../features/auth/api/keys.ts';
import { useOwnShop } from '../../../features/shop-settings/api/get-own-shop.ts';
import { ShopSettingsForm } from '../../../features/shop-settings/components/shop-settings-form.tsx';

export function ShopSettingsPage() {
  const shop = useOwnShop();
  const queryClient = useQueryClient();
  return (
    <QueryPage eyebrow="Workroom" title="Shop settings" lead="How your shop appears to shoppers, and what they can expect from you." narrow query={shop} loading="Loading your shop…">
      {(data) => (
        // the header reads the shop's name from /api/me, so refresh it after a save
        <ShopSettingsForm key={data.slug} shop={data} onSaved={() => void queryClient.invalidateQueries({ queryKey: authKeys.me() })} />
      )}
    </QueryPage>
  );
}

export default ShopSettingsPage;
