import { zodResolver } from '@hookform/resolvers/zod';
import { useId } from 'react';
import { useForm } from 'react-hook-form';
import { CARRIERS, type ShipInput, shipSchema } from '../../../../shared/schemas/workroom.ts';
import { Button } from '../../../components/ui/button.tsx';
import { TextField } from '../../../components/ui/text-field.tsx';
import { useToast } from '../../../components/ui/toast.tsx';
import { applyServerErrors } from '../../../lib/form-errors.ts';
import { useShipOrder } from '../api/ship-order.ts';

/** Carrier and tracking number → every pressed line shipped, and the shopper gets an e-mail. */
export function ShipForm({ orderId }: { orderId: string }) {
  const id = useId();
  const toast = useToast();
  const ship = useShipOrder();
  const form = useForm<ShipInput>({ resolver: zodResolver(shipSchema), defaultValues: { carrier: '', trackingNumber: '' } });
  const onSubmit = form.handleSubmit(async (values) => {
    try {
      await ship.mutateAsync({ orderId, ...values });
      toast.success('Marked shipped. The shopper has an e-mail with the tracking number.');
    } catch (e) {
      const msg = applyServerErrors(e, form.setError, ['carrier', 'trackingNumber']);
      if (msg) toast.error(msg);
    }
  });
  return (
    <form noValidate onSubmit={onSubmit} className="flex flex-col gap-4">
      <TextField label="Carrier" list={`${id}-carriers`} autoComplete="off" error={form.formState.errors.carrier?.message} {...form.register('carrier')} />
      <datalist id={`${id}-carriers`}>
        {CARRIERS.map((c) => (
          <option key={c} value={c} />
        ))}
      </datalist>
      <TextField label="Tracking number" autoComplete="off" spellCheck={false} error={form.formState.errors.trackingNumber?.message} {...form.register('trackingNumber')} />
      <Button type="submit" pending={ship.isPending} pendingLabel="Saving…" className="self-start">
        Mark shipped
      </Button>
    </form>
  );
}
