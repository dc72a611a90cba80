import { ButtonLink } from '../../../components/ui/button.tsx';
import { PageHeading } from '../../../components/ui/card.tsx';
import { paths } from '../../../config/paths.ts';
import { BusinessCharts } from '../../../features/business/components/business-charts.tsx';
import { CostsTable } from '../../../features/business/components/costs-table.tsx';
import { DueList } from '../../../features/business/components/due-list.tsx';
import { DiscountsGivenAway } from '../../../features/offers/components/discount-codes.tsx';

export function BusinessOverviewPage() {
  return (
    <div>
      <PageHeading eyebrow="Workroom" title="Your business" lead="What is due when, what each item really cost you, and what you earn after fees." />
      {/* ship-by dates and margins come from these settings, so they are one step from the overview */}
      <ButtonLink to={paths.business.settings.getHref()} variant="secondary" className="mb-8">
        Calendar and rate
      </ButtonLink>
      <div className="flex flex-col gap-10">
        <DueList />
        <BusinessCharts />
        <CostsTable />
        <DiscountsGivenAway />
      </div>
    </div>
  );
}

export default BusinessOverviewPage;
