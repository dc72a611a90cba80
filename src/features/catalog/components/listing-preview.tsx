import { blankFor } from '../../../../shared/engine/listing-design.ts';
import type { ListingPage } from '../../../../shared/schemas/catalog.ts';
import { DesignOnBlank, DesignPieces, pictureOfListingBlank } from '../../../components/design/design-on-blank.tsx';
import { useListingPreview } from '../api/get-listing-preview.ts';

/** The default name's design on the listing's blank, made by the server; a bare blank when there is none. */
export function ListingPreview({ listing, label }: { listing: ListingPage; label: string }) {
  const pieces = useListingPreview(listing.slug).data;
  return (
    <div className="mx-auto w-full max-w-md" data-testid="listing-preview">
      <DesignOnBlank blank={pictureOfListingBlank(listing)} rulers label={label}>
        {pieces ? <DesignPieces pieces={pieces} /> : null}
      </DesignOnBlank>
    </div>
  );
}
