import { zodResolver } from '@hookform/resolvers/zod';
import { useRef, useState } from 'react';
import { useForm } from 'react-hook-form';
import { type OwnShop, type ShopSettingsInput, shopSettingsSchema } from '../../../../shared/schemas/shop.ts';
import { Button } from '../../../components/ui/button.tsx';
import { CheckboxField, FormSection, MoneyController, ProgressBar, SelectField, TextAreaField } from '../../../components/ui/form-controls.tsx';
import { TextField } from '../../../components/ui/text-field.tsx';
import { useToast } from '../../../components/ui/toast.tsx';
import { isApiError } from '../../../lib/api-client.ts';
import { applyServerErrors } from '../../../lib/form-errors.ts';
import { useUpdateShopSettings } from '../api/update-shop-settings.ts';
import { useUploadShopLogo } from '../api/upload-shop-logo.ts';

type Values = {
  name: string;
  slug: string;
  description: string;
  processingDays: number;
  shippingMinor: number;
  returnPolicy: string;
  pressType: 'handheld' | 'clamshell';
  backPress: boolean;
};
const FIELDS = ['name', 'slug', 'description', 'processingDays', 'shippingMinor', 'returnPolicy', 'pressType', 'backPress'] as const;

const stateNote: Record<OwnShop['state'], string> = {
  in_review: 'Your shop is waiting for the Namesake team to review it. Shoppers will see it once it is approved.',
  live: 'Your shop is live. Shoppers can find your approved listings.',
  suspended: 'Your shop is suspended and hidden from shoppers.',
  rejected: 'Your shop was not approved.',
};

export function ShopSettingsForm({ shop, onSaved }: { shop: OwnShop; onSaved?: (shop: OwnShop) => void }) {
  const toast = useToast();
  const update = useUpdateShopSettings();
  const { register, handleSubmit, setError, control, formState, reset } = useForm<Values, unknown, ShopSettingsInput>({
    resolver: zodResolver(shopSettingsSchema) as never,
    // a change waiting for review is what the seller last saved: the form shows it
    defaultValues: {
      name: shop.pendingChange?.name ?? shop.name,
      slug: shop.slug,
      description: shop.pendingChange?.description ?? shop.description,
      processingDays: shop.processingDays,
      shippingMinor: shop.shippingMinor,
      returnPolicy: shop.returnPolicy,
      pressType: shop.pressType,
      backPress: shop.backPress,
    },
  });
  const e = formState.errors;

  const onSubmit = handleSubmit(async (values) => {
    try {
      const saved = await update.mutateAsync(values);
      reset({ ...values, slug: saved.slug, name: saved.pendingChange?.name ?? saved.name, description: saved.pendingChange?.description ?? saved.description } as Values);
      toast.success(saved.pendingChange ? 'Shop settings saved. The new name or description waits for review.' : 'Shop settings saved.');
      onSaved?.(saved);
    } catch (error) {
      const message = applyServerErrors(error, setError, FIELDS);
      if (message) toast.error(message);
    }
  });

  return (
    <div className="flex flex-col gap-6">
      <p className="rounded-lg border border-line bg-paper-deep p-4 text-ink">
        <strong>Shop state:</strong> {stateNote[shop.state]}
        {shop.stateReason ? <span className="mt-1 block text-ink-soft">Message from the team: {shop.stateReason}</span> : null}
      </p>
      {shop.pendingChange ? (
        <p className="rounded-lg border border-marigold bg-paper-deep p-4 text-ink" role="status">
          <strong>Waiting for review:</strong> your new{' '}
          {[shop.pendingChange.name !== undefined ? 'name' : null, shop.pendingChange.description !== undefined ? 'description' : null].filter(Boolean).join(' and ')}. Shoppers keep seeing “
          {shop.name}” and its current description until the Namesake team approves the change.
        </p>
      ) : shop.changeRejectionReason ? (
        <p className="rounded-lg border border-danger bg-danger-wash p-4 text-ink">
          <strong>Your last change to the name or description was not approved.</strong>
          <span className="mt-1 block">Message from the team: {shop.changeRejectionReason}</span>
        </p>
      ) : null}
      <LogoPanel shop={shop} />
      <form noValidate onSubmit={onSubmit} className="flex flex-col gap-6">
        <FormSection title="About the shop">
          <TextField label="Shop name" maxLength={60} error={e.name?.message} {...register('name')} />
          <TextField
            label="Web address"
            hint={`Your shop page: /shops/${shop.slug}. Lower-case letters, digits and dashes.`}
            maxLength={60}
            autoCapitalize="none"
            spellCheck={false}
            error={e.slug?.message}
            {...register('slug')}
          />
          <TextAreaField
            label="Description"
            hint="A few sentences about what you make. Shown on your shop page."
            rows={4}
            maxLength={2000}
            error={e.description?.message}
            {...register('description')}
          />
        </FormSection>
        <FormSection title="Orders and shipping">
          <div className="grid grid-cols-1 gap-5 sm:grid-cols-2">
            <TextField
              label="Processing days"
              hint="Working days from an approved proof to shipping."
              type="number"
              inputMode="numeric"
              min={1}
              max={60}
              error={e.processingDays?.message}
              {...register('processingDays', { valueAsNumber: true })}
            />
            <MoneyController
              control={control}
              name="shippingMinor"
              label="Shipping price per order"
              hint={`In ${shop.currency}. One price however many of your items are in the order.`}
              currency={shop.currency}
              error={e.shippingMinor?.message}
            />
          </div>
          <TextAreaField label="Return policy" rows={4} maxLength={2000} error={e.returnPolicy?.message} {...register('returnPolicy')} />
          <SelectField label="Your heat press" hint="Press cards use this press type's settings from your materials." error={e.pressType?.message} {...register('pressType')}>
            <option value="clamshell">Clamshell or swing-away press</option>
            <option value="handheld">Handheld press</option>
          </SelectField>
          <CheckboxField label="Press from the back too" hint="Press cards and the press run add a press from the back after the final press." {...register('backPress')} />
        </FormSection>
        <div className="flex flex-wrap items-center gap-3">
          <Button type="submit" pending={formState.isSubmitting} pendingLabel="Saving…">
            Save shop settings
          </Button>
          {formState.isDirty ? <span className="text-sm text-ink-soft">You have unsaved changes.</span> : null}
        </div>
      </form>
    </div>
  );
}

function LogoPanel({ shop }: { shop: OwnShop }) {
  const toast = useToast();
  const uploadLogo = useUploadShopLogo();
  const removeLogo = useUpdateShopSettings();
  const [progress, setProgress] = useState<number | null | undefined>(undefined);
  const [error, setError] = useState<string | null>(null);
  const input = useRef<HTMLInputElement>(null);

  async function onFile(file: File | undefined) {
    if (!file) return;
    setError(null);
    setProgress(0);
    try {
      await uploadLogo.mutateAsync({ file, onProgress: setProgress });
      toast.success('Logo updated.');
    } catch (err) {
      setError(isApiError(err) ? err.message : 'The logo could not be uploaded.');
    } finally {
      setProgress(undefined);
      if (input.current) input.current.value = '';
    }
  }

  return (
    <FormSection title="Logo" lead="A square JPEG, PNG or WebP image, up to 8 MB.">
      <div className="flex flex-col gap-4 sm:flex-row sm:items-center">
        <div className="flex size-24 shrink-0 items-center justify-center overflow-hidden rounded-lg border-2 border-dashed border-thread/60 bg-paper">
          {shop.logoUrl ? <img src={shop.logoUrl} alt={`${shop.name} logo`} className="size-full object-cover" /> : <span className="text-sm text-ink-faint">No logo</span>}
        </div>
        <div className="flex min-w-0 flex-1 flex-col gap-3">
          <label className="flex flex-col gap-1.5">
            <span className="font-bold">Choose a logo image</span>
            <input
              ref={input}
              type="file"
              accept="image/jpeg,image/png,image/webp"
              disabled={progress !== undefined}
              aria-describedby={error ? 'logo-error' : undefined}
              className="min-h-11 text-base file:mr-3 file:min-h-11 file:rounded-lg file:border-2 file:border-thread file:bg-paper file:px-4 file:font-bold file:text-thread-deep"
              onChange={(ev) => void onFile(ev.target.files?.[0])}
            />
          </label>
          {progress !== undefined ? <ProgressBar value={progress} label="Uploading logo" /> : null}
          {error ? (
            <p id="logo-error" role="alert" className="text-sm font-semibold text-danger">
              {error}
            </p>
          ) : null}
          {shop.logoUrl ? (
            <Button
              variant="quiet"
              className="self-start"
              pending={removeLogo.isPending}
              onClick={() => removeLogo.mutate({ logoId: null }, { onError: (err) => toast.error(err.message), onSuccess: () => toast.success('Logo removed.') })}
            >
              Remove logo
            </Button>
          ) : null}
        </div>
      </div>
    </FormSection>
  );
}
