import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { openShopSchema, type OpenShopInput } from '../../../../shared/schemas/auth.ts';
import { Button } from '../../../components/ui/button.tsx';
import { TextField } from '../../../components/ui/text-field.tsx';
import { useToast } from '../../../components/ui/toast.tsx';
import { applyServerErrors } from '../../../lib/form-errors.ts';
import { useCreateShop, type CreatedShop } from '../api/create-shop.ts';

export function OpenShopForm({ onOpened }: { onOpened: (shop: CreatedShop) => void | Promise<void> }) {
  const toast = useToast();
  const createShop = useCreateShop();
  const { register, handleSubmit, setError, formState } = useForm<OpenShopInput>({
    resolver: zodResolver(openShopSchema),
    defaultValues: { name: '' },
  });

  const onSubmit = handleSubmit(async (values) => {
    try {
      const shop = await createShop.mutateAsync(values);
      await onOpened(shop);
    } catch (error) {
      const message = applyServerErrors(error, setError, ['name']);
      if (message) toast.error(message);
    }
  });

  return (
    <form noValidate onSubmit={onSubmit} className="flex flex-col gap-5">
      <TextField
        label="Shop name"
        hint="Shown on your listings and your shop page. Your shop's web address is made from it."
        autoComplete="organization"
        maxLength={120}
        error={formState.errors.name?.message}
        {...register('name')}
      />
      <Button type="submit" pending={formState.isSubmitting || createShop.isPending} pendingLabel="Opening your shop…" className="w-full sm:w-auto sm:self-start">
        Open my shop
      </Button>
    </form>
  );
}
