import { useNavigate, useParams } from 'react-router-dom';
import { Spinner } from '../../../components/ui/button.tsx';
import { PageHeading } from '../../../components/ui/card.tsx';
import { paths } from '../../../config/paths.ts';
import { BlankOfferPicker } from '../../../features/blanks/components/blank-offer-picker.tsx';
import { PricingHelper } from '../../../features/business/components/pricing-helper.tsx';
import { useFonts } from '../../../features/listings-editor/api/get-fonts.ts';
import { useSellerListing } from '../../../features/listings-editor/api/get-seller-listing.ts';
import { ListingEditor } from '../../../features/listings-editor/components/listing-editor.tsx';
import { useAllMaterials } from '../../../features/materials/api/get-materials.ts';
import { useOwnShop } from '../../../features/shop-settings/api/get-own-shop.ts';
import { useMotifs } from '../../../features/uploads/api/get-motifs.ts';
import { MotifPreview, MotifUpload } from '../../../features/uploads/components/motif-upload.tsx';
import { PhotoPicker } from '../../../features/uploads/components/photo-picker.tsx';

/** New listing (/workroom/listings/new) and edit (/workroom/listings/:id/edit). */
export function ListingEditPage() {
  const { id } = useParams();
  const navigate = useNavigate();
  const listing = useSellerListing(id);
  const shop = useOwnShop();
  const fonts = useFonts();
  const materials = useAllMaterials({ archived: false });
  const motifs = useMotifs();

  const queries = [shop, fonts, materials, motifs, ...(id ? [listing] : [])];
  const failed = queries.find((q) => q.isError);
  const loading = queries.some((q) => q.isPending);

  return (
    <div>
      <PageHeading
        eyebrow="Listings"
        title={id ? (listing.data ? `Edit “${listing.data.draft.title}”` : 'Edit listing') : 'New listing'}
        lead="Fill in what shoppers see and what they can personalise. Your typing is kept in this browser until it is saved."
      />
      <div className="max-w-4xl">
        {failed ? (
          <p role="alert" className="font-semibold text-danger">
            {failed.error?.message}
          </p>
        ) : loading ? (
          <Spinner label="Loading…" />
        ) : (
          <ListingEditor
            key={id ?? 'new'}
            listing={id ? listing.data : undefined}
            currency={shop.data!.currency}
            fonts={fonts.data!}
            materials={materials.data!}
            motifs={motifs.data!}
            PhotoPicker={PhotoPicker}
            MotifPreview={MotifPreview}
            motifUpload={<MotifUpload />}
            PricingHelper={PricingHelper}
            BlankOfferPicker={BlankOfferPicker}
            onSaved={(saved, created) => {
              if (created) navigate(paths.seller.editListing.getHref(saved.id), { replace: true });
            }}
          />
        )}
      </div>
    </div>
  );
}

export default ListingEditPage;
