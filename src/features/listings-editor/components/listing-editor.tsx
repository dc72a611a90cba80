import { zodResolver } from '@hookform/resolvers/zod';
import { type ComponentType, type ReactNode, useEffect, useRef, useState } from 'react';
import { Controller, type FieldErrors, type Path, useForm, useWatch } from 'react-hook-form';
import type { ListingBlankOffer } from '../../../../shared/schemas/blanks.ts';
import type { FontInfo } from '../../../../shared/schemas/engine.ts';
import {
  BLANK_DEFAULTS,
  BLANK_KINDS,
  type BlankKind,
  type ListingContent,
  type ListingInput,
  listingInputSchema,
  materialIdsOf,
  OCCASION_LABELS,
  OCCASIONS,
  type SellerListing,
} from '../../../../shared/schemas/listing.ts';
import type { Material } from '../../../../shared/schemas/material.ts';
import { formatLength } from '../../../../shared/units.ts';
import { Button } from '../../../components/ui/button.tsx';
import { CheckboxField, FieldError, FormSection, MoneyController, SelectField, TextAreaField } from '../../../components/ui/form-controls.tsx';
import { TextField } from '../../../components/ui/text-field.tsx';
import { useToast } from '../../../components/ui/toast.tsx';
import { isApiError } from '../../../lib/api-client.ts';
import { useListingAction } from '../api/listing-actions.ts';
import { useCreateListing, useUpdateListing } from '../api/save-listing.ts';
import { LISTING_STATE_LABELS, ListingStateBadges } from './listing-state.tsx';
import { type EditorMotif, type MotifPreviewProps, PersonalisationEditor } from './personalisation-editor.tsx';

export type PhotoPickerProps = { value: string[]; onChange: (ids: string[]) => void; error?: string };
/** the editor's current (watched) values and the shop's currency; the helper sends only the parts that cost */
export type PricingHelperProps = { values: unknown; currency: string };
export type BlankOfferPickerProps = {
  value: ListingBlankOffer | null | undefined;
  onChange: (offer: ListingBlankOffer | null) => void;
  vinyls: Array<{ id: string; colourName: string; colourHex: string }>;
  error?: string;
};

type Props = {
  listing?: SellerListing;
  currency: string;
  fonts: FontInfo[];
  materials: Material[];
  motifs: EditorMotif[];
  PhotoPicker: ComponentType<PhotoPickerProps>;
  MotifPreview: ComponentType<MotifPreviewProps>;
  motifUpload: ReactNode;
  /** the cost and margin check under "Costing" (the business feature's, handed in by the route) */
  PricingHelper: ComponentType<PricingHelperProps>;
  /** the shop's blank sizes and colours offered on this listing (the blanks feature's, handed in by the route) */
  BlankOfferPicker?: ComponentType<BlankOfferPickerProps>;
  /** after a save; `created` when the listing was new (the page moves to its edit URL) */
  onSaved: (listing: SellerListing, created: boolean) => void;
};

export function emptyListing(): ListingInput {
  const d = BLANK_DEFAULTS.tote;
  return {
    title: '',
    description: '',
    descriptionFormat: 'plain',
    blank: { kind: 'tote', label: d.label, widthMm: d.widthMm, heightMm: d.heightMm, topOffsetMm: d.topOffsetMm },
    basePriceMinor: Number.NaN,
    extraLayerPriceMinor: 0,
    occasions: [],
    photoIds: [],
    hasSmallDecorations: false,
    personalisation: { textFields: [], motifChoices: [], motifRequired: false, outline: null },
    blankCostMinor: 0,
    minutesPerLayer: 0,
  };
}

const draftKey = (id: string | undefined) => `namesake:listing-draft:${id ?? 'new'}`;

function readDraft(id: string | undefined): ListingInput | null {
  try {
    const raw = window.localStorage.getItem(draftKey(id));
    return raw ? (JSON.parse(raw, (_k, v) => (v === '__NaN__' ? Number.NaN : v)) as ListingInput) : null;
  } catch {
    return null;
  }
}
function writeDraft(id: string | undefined, values: unknown) {
  try {
    window.localStorage.setItem(
      draftKey(id),
      JSON.stringify(values, (_k, v) => (typeof v === 'number' && Number.isNaN(v) ? '__NaN__' : v)),
    );
  } catch {
    // storage full or disabled: the form still works, only the browser copy is lost
  }
}
const clearDraft = (id: string | undefined) => {
  try {
    window.localStorage.removeItem(draftKey(id));
  } catch {
    /* ignore */
  }
};

/** Collects every message in an errors tree, so a failed save can say how many fields need attention. */
function countErrors(e: unknown): number {
  if (!e || typeof e !== 'object') return 0;
  let n = 'message' in e && typeof (e as { message?: unknown }).message === 'string' ? 1 : 0;
  for (const [k, v] of Object.entries(e)) if (k !== 'ref' && k !== 'message' && k !== 'type' && k !== 'types') n += countErrors(v);
  return n;
}

export function ListingEditor({ listing, currency, fonts, materials, motifs, PhotoPicker, MotifPreview, motifUpload, PricingHelper, BlankOfferPicker, onSaved }: Props) {
  const toast = useToast();
  const create = useCreateListing();
  const update = useUpdateListing();
  const action = useListingAction();
  const id = listing?.id;
  const serverValues = (listing?.draft as ListingInput | undefined) ?? emptyListing();
  const [restored] = useState(() => readDraft(id));
  const [formError, setFormError] = useState<string | null>(null);

  const { register, control, handleSubmit, setValue, setError, reset, formState, getValues } = useForm<ListingInput, unknown, ListingContent>({
    resolver: zodResolver(listingInputSchema),
    defaultValues: restored ?? serverValues,
  });
  const e = formState.errors;

  // keep a copy of what is typed in this browser, so a reload or a failed save loses nothing
  // (compared with the last saved content rather than trusting isDirty, which field
  // transforms can leave set; `finished` stops a new listing's page writing while it moves away)
  const values = useWatch({ control });
  const baseline = useRef<string>(JSON.stringify(serverValues));
  const finished = useRef(false);
  // 300 ms after the last change: any change sooner re-runs this and cancels the timer, so `values`
  // is the newest state when it fires
  useEffect(() => {
    const t = window.setTimeout(() => {
      if (finished.current) return;
      if (JSON.stringify(values) === baseline.current) clearDraft(id);
      else writeDraft(id, values);
    }, 300);
    return () => window.clearTimeout(t);
  }, [values, id]);

  const blankKind = useWatch({ control, name: 'blank.kind' }) as BlankKind;
  const blank = useWatch({ control, name: 'blank' });
  const describe = useWatch({ control, name: 'descriptionFormat' });
  // the vinyl colours the personalisation offers so far (half-typed rows may lack their lists)
  let usedIds: string[] = [];
  try {
    usedIds = materialIdsOf(values.personalisation as ListingContent['personalisation']);
  } catch {
    usedIds = [];
  }

  async function save(content: ListingContent, thenSubmit: boolean) {
    setFormError(null);
    try {
      // the parsed content is valid input too; the server parses it again with the same schema
      const input = content as unknown as ListingInput;
      let saved = id ? await update.mutateAsync({ id, input }) : await create.mutateAsync(input);
      if (thenSubmit && (saved.state === 'draft' || saved.state === 'rejected')) saved = await action.mutateAsync({ id: saved.id, action: 'submit' });
      if (!id) finished.current = true;
      clearDraft(id);
      reset(saved.draft as ListingInput);
      baseline.current = JSON.stringify(getValues());
      toast.success(thenSubmit ? 'Saved and sent for review.' : saved.pendingReview && saved.live ? 'Saved. The changes wait for review; the approved version stays on sale.' : 'Listing saved.');
      onSaved(saved, !id);
    } catch (error) {
      if (isApiError(error) && error.fields) {
        let firstField = true;
        for (const [field, message] of Object.entries(error.fields)) {
          setError(field as Path<ListingInput>, { type: 'server', message }, { shouldFocus: firstField });
          firstField = false;
        }
      }
      const message = isApiError(error) ? error.message : 'The listing could not be saved. Your changes are kept in this browser.';
      setFormError(message);
      toast.error(message);
    }
  }

  const onInvalid = (errs: FieldErrors<ListingInput>) => {
    const n = countErrors(errs);
    const message = `${n} field${n === 1 ? ' needs' : 's need'} attention before saving. Nothing you typed is lost.`;
    setFormError(message);
    toast.error(message);
  };

  const state = listing?.state;
  const canSubmit = !listing || ((state === 'draft' || state === 'rejected') && !listing.pendingReview);
  const busy = formState.isSubmitting || create.isPending || update.isPending || action.isPending;

  return (
    <form noValidate onSubmit={handleSubmit((c) => save(c, false), onInvalid)} className="flex flex-col gap-6">
      {listing ? (
        <div className="flex flex-col gap-2 rounded-lg border border-line bg-paper-deep p-4">
          <ListingStateBadges state={listing.state} pendingReview={listing.pendingReview} />
          <p className="text-ink-soft">{listing.pendingReview ? 'Your latest changes wait for review; shoppers still see the approved version.' : LISTING_STATE_LABELS[listing.state].help}</p>
          {listing.rejectionReason ? (
            <p className="font-semibold text-danger">
              Reason from the moderator: <span className="font-normal whitespace-pre-wrap text-ink">{listing.rejectionReason}</span>
            </p>
          ) : null}
        </div>
      ) : null}
      {restored ? (
        <div role="status" className="flex flex-col gap-2 rounded-lg border-2 border-marigold bg-marigold-wash p-4 sm:flex-row sm:items-center sm:justify-between">
          <p>Unsaved changes from this browser were restored.</p>
          <Button
            variant="quiet"
            onClick={() => {
              clearDraft(id);
              // a fresh page is the simplest way to reset every field, money inputs included
              window.location.reload();
            }}
          >
            Discard them
          </Button>
        </div>
      ) : null}

      <FormSection title="The listing">
        <TextField label="Title" maxLength={100} error={e.title?.message} {...register('title')} />
        <fieldset className="flex flex-col gap-2">
          <legend className="font-bold">Description format</legend>
          <div className="flex flex-wrap gap-4">
            <label className="flex min-h-11 items-center gap-2">
              <input type="radio" value="plain" className="size-5 accent-thread" {...register('descriptionFormat')} /> Plain text
            </label>
            <label className="flex min-h-11 items-center gap-2">
              <input type="radio" value="markdown" className="size-5 accent-thread" {...register('descriptionFormat')} /> Markdown
            </label>
          </div>
        </fieldset>
        <TextAreaField
          label="Description"
          rows={6}
          maxLength={5000}
          hint={
            describe === 'markdown'
              ? 'Markdown: **bold**, *italic*, lists with “- ”, blank line between paragraphs. HTML is shown as plain text, never run.'
              : 'Shown as you type it, with line breaks.'
          }
          error={e.description?.message}
          {...register('description')}
        />
        <fieldset className="flex flex-col gap-2">
          <legend className="font-bold">Occasions</legend>
          <div className="flex flex-wrap gap-x-5 gap-y-1">
            {OCCASIONS.map((o) => (
              <label key={o} className="flex min-h-11 items-center gap-2">
                <input type="checkbox" value={o} className="size-5 accent-thread" {...register('occasions')} /> {OCCASION_LABELS[o]}
              </label>
            ))}
          </div>
          <FieldError message={e.occasions?.message} />
        </fieldset>
        <CheckboxField label="Has small decorations (bows, buttons, gems)" hint="Shoppers then see a choking-hazard note for children under 3." {...register('hasSmallDecorations')} />
      </FormSection>

      <FormSection title="Blank and print area" lead="Prefilled for each blank; change them to match the blanks you buy.">
        <div className="grid grid-cols-1 gap-5 sm:grid-cols-2">
          <SelectField
            label="Blank"
            error={e.blank?.kind?.message}
            {...register('blank.kind', {
              onChange: (ev: { target: { value: BlankKind } }) => {
                const d = BLANK_DEFAULTS[ev.target.value];
                if (!d) return;
                setValue('blank.label', d.label);
                setValue('blank.widthMm', d.widthMm, { shouldValidate: true });
                setValue('blank.heightMm', d.heightMm, { shouldValidate: true });
                setValue('blank.topOffsetMm', d.topOffsetMm, { shouldValidate: true });
              },
            })}
          >
            {BLANK_KINDS.map((k) => (
              <option key={k} value={k}>
                {BLANK_DEFAULTS[k].label}
              </option>
            ))}
          </SelectField>
          <TextField label="Name shown to shoppers" hint="e.g. “Natural cotton tote”." maxLength={60} error={e.blank?.label?.message} {...register('blank.label')} />
        </div>
        <div className="grid grid-cols-1 gap-5 sm:grid-cols-3">
          {(
            [
              ['widthMm', 'Print width (mm)'],
              ['heightMm', 'Print height (mm)'],
              ['topOffsetMm', 'Top offset (mm)'],
            ] as const
          ).map(([k, label]) => (
            <TextField
              key={k}
              label={label}
              hint={typeof blank?.[k] === 'number' && Number.isFinite(blank[k]) ? formatLength(blank[k]!) : '\u00a0'}
              type="number"
              inputMode="decimal"
              error={e.blank?.[k]?.message}
              {...register(`blank.${k}`, { valueAsNumber: true })}
            />
          ))}
        </div>
        <p className="text-sm text-ink-soft">Top offset: from the top edge of the blank ({BLANK_DEFAULTS[blankKind]?.label ?? 'blank'}) down to the top of the print area.</p>
        {BlankOfferPicker ? (
          <Controller
            control={control}
            name="blankOffer"
            render={({ field }) => (
              <BlankOfferPicker
                value={field.value as ListingBlankOffer | null | undefined}
                onChange={field.onChange}
                vinyls={materials.filter((m) => usedIds.includes(m.id))}
                error={e.blankOffer?.message ?? e.blankOffer?.sizeIds?.message ?? e.blankOffer?.colourIds?.message ?? e.blankOffer?.blankTypeId?.message ?? e.blankOffer?.defaultColourId?.message}
              />
            )}
          />
        ) : null}
      </FormSection>

      <FormSection title="Price">
        <div className="grid grid-cols-1 gap-5 sm:grid-cols-2">
          <MoneyController
            control={control}
            name="basePriceMinor"
            label="Base price"
            hint="The simplest design a shopper can make; layers beyond it add the extra-layer price."
            currency={currency}
            error={e.basePriceMinor?.message}
          />
          <MoneyController
            control={control}
            name="extraLayerPriceMinor"
            label="Price per extra layer"
            hint="Added for each colour after the first."
            currency={currency}
            error={e.extraLayerPriceMinor?.message}
          />
        </div>
      </FormSection>

      <FormSection title="Photos" lead="Up to 8. The first is the thumbnail in search results.">
        <Controller
          control={control}
          name="photoIds"
          render={({ field }) => <PhotoPicker value={field.value ?? []} onChange={field.onChange} error={e.photoIds?.message ?? e.photoIds?.root?.message} />}
        />
      </FormSection>

      <PersonalisationEditor
        control={control}
        register={register}
        setValue={setValue}
        errors={e}
        fonts={fonts}
        materials={materials}
        motifs={motifs}
        MotifPreview={MotifPreview}
        motifUpload={motifUpload}
      />

      <FormSection title="Costing (only you see this)" lead="Used by your workroom to estimate cost per item.">
        <div className="grid grid-cols-1 gap-5 sm:grid-cols-2">
          <MoneyController control={control} name="blankCostMinor" label="Cost of one blank" currency={currency} error={e.blankCostMinor?.message} />
        </div>
        <p className="text-sm text-ink-soft">Labour is estimated from each design's own cut pieces at the weeding rates and hourly rate in your Business settings.</p>
        <PricingHelper values={values} currency={currency} />
      </FormSection>

      <div className="sticky bottom-0 z-10 -mx-4 flex flex-col gap-3 border-t border-line bg-paper/95 px-4 py-4 sm:mx-0 sm:rounded-lg sm:border sm:px-5">
        {formError ? (
          <p role="alert" className="font-semibold text-danger">
            {formError}
          </p>
        ) : null}
        <div className="flex flex-wrap gap-3">
          <Button type="submit" variant={canSubmit ? 'secondary' : 'primary'} pending={busy} pendingLabel="Saving…">
            {listing?.live ? 'Save changes' : 'Save draft'}
          </Button>
          {canSubmit ? (
            <Button variant="primary" disabled={busy} onClick={() => void handleSubmit((c) => save(c, true), onInvalid)()}>
              Save and submit for review
            </Button>
          ) : null}
        </div>
        {listing?.live ? <p className="text-sm text-ink-soft">Changes to a listing on sale go to review; the approved version stays on sale meanwhile.</p> : null}
      </div>
    </form>
  );
}
