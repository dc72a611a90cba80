import { openShopSchema } from '../../../../shared/schemas/auth.ts';
import { SubmitForm } from '../../../components/ui/form-controls.tsx';
import { TextField } from '../../../components/ui/text-field.tsx';
import { useServerForm } from '../../../lib/use-server-form.ts';
import { type CreatedShop, useCreateShop } from '../api/create-shop.ts';

export function OpenShopForm({ onOpened }: { onOpened: (shop: CreatedShop) => void | Promise<void> }) {
  const createShop = useCreateShop();
  const { register, formProps, formState } = useServerForm({
    schema: openShopSchema,
    defaultValues: { name: '' },
    fields: ['name'],
    submit: async (values) => {
      const shop = await createShop.mutateAsync(values);
      await onOpened(shop);
    },
  });

  return (
    <SubmitForm {...formProps} pendingLabel="Opening your shop…" submitLabel="Open my shop">
      <TextField
        label="Shop name"
        hint="Shown on your listings and your shop page. Your shop's web address is made from it."
        autoComplete="organization"
        maxLength={120}
        error={formState.errors.name?.message}
        {...register('name')}
      />
    </SubmitForm>
  );
}
