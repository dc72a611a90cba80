import { QueryPage } from '../../../components/ui/query-boundary.tsx';
import { useBusinessSettings } from '../../../features/business/api/get-business-settings.ts';
import { BusinessSettingsForm } from '../../../features/business/components/business-settings-form.tsx';

export function BusinessSettingsPage() {
  const settings = useBusinessSettings();
  return (
    <QueryPage
      eyebrow="Business"
      title="Calendar and rate"
      lead="The days you work decide every ship-by date; your hourly rate puts labour into your margins."
      narrow
      query={settings}
      loading="Loading your settings…"
    >
      {(data) => <BusinessSettingsForm settings={data} />}
    </QueryPage>
  );
}

export default BusinessSettingsPage;
