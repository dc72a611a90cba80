import { ButtonLink } from '../../../components/ui/button.tsx';
import { PageHeading, StitchedBox } from '../../../components/ui/card.tsx';
import { paths } from '../../../config/paths.ts';
import { useMe } from '../../../features/auth/api/get-me.ts';

export function OrdersPage() {
  const me = useMe();
  return (
    <div>
      <PageHeading title="Your orders" lead={me.data ? `Everything ${me.data.user.name} has ordered, with each shop's progress.` : undefined} />
      <StitchedBox className="flex flex-col items-center gap-4 py-14 text-center">
        <p className="text-xl font-extrabold">No orders yet</p>
        <p className="max-w-md text-ink-soft">When you order, you'll follow each item here: proof, cutting, pressing and shipping.</p>
        <ButtonLink to={paths.search.getHref()} variant="secondary">
          Browse the shops
        </ButtonLink>
      </StitchedBox>
    </div>
  );
}
