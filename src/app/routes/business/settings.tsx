import { Spinner } from '../../../components/ui/button.tsx';
import { PageHeading } from '../../../components/ui/card.tsx';
import { useBusinessSettings } from '../../../features/business/api/get-business-settings.ts';
import { BusinessSettingsForm } from '../../../features/business/components/business-settings-form.tsx';
import { SellerNav } from '../seller/seller-nav.tsx';

export function BusinessSettingsPage() {
  const settings = useBusinessSettings();
  return (
    <div>
      <SellerNav />
      <PageHeading eyebrow="Business" title="Calendar and rate" lead="The days you work decide every ship-by date; your hourly rate puts labour into your margins." />
      <div className="max-w-3xl">
        {settings.isPending ? <Spinner label="Loading your settings…" /> : null}
        {settings.isError ? <p role="alert" className="font-semibold text-danger">{settings.error.message}</p> : null}
        {settings.data ? <BusinessSettingsForm settings={settings.data} /> : null}
      </div>
    </div>
  );
}

export default BusinessSettingsPage;
