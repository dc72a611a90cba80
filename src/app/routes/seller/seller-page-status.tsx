import { ButtonLink, Spinner } from '../../../components/ui/button.tsx';
import { paths } from '../../../config/paths.ts';

/** A seller page still loading (no error yet) or failed: a spinner, or the error and a way back (the navigation stays above, from SellerLayout). */
export function SellerPageStatus({ error, loading }: { error: Error | null; loading: string }) {
  return error ? (
    <div role="alert" className="flex flex-col items-start gap-4 py-8">
      <p className="text-lg font-bold">{error.message}</p>
      <ButtonLink to={paths.workroom.getHref()} variant="secondary">
        Back to the workroom
      </ButtonLink>
    </div>
  ) : (
    <Spinner label={loading} />
  );
}
