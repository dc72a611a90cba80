import { ButtonLink } from '../../../components/ui/button.tsx';
import { PageHeading, StitchedBox } from '../../../components/ui/card.tsx';
import { paths } from '../../../config/paths.ts';

export function CartPage() {
  return (
    <div>
      <PageHeading title="Your cart" lead="Items from several shops can share one cart; you pay once at checkout." />
      <StitchedBox className="flex flex-col items-center gap-4 py-14 text-center">
        <p className="text-xl font-extrabold">Your cart is empty</p>
        <p className="max-w-md text-ink-soft">Find a tote, tee or pouch, type a name on it, and it will wait for you here.</p>
        <ButtonLink to={paths.search.getHref()}>Start browsing</ButtonLink>
      </StitchedBox>
    </div>
  );
}
