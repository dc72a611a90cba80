import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { MAX_LINE_QUANTITY, type UpdateCartLineInput, updateCartLineSchema } from '../../../../shared/schemas/cart.ts';
import { Button } from '../../../components/ui/button.tsx';
import { useToast } from '../../../components/ui/toast.tsx';
import { applyServerErrors } from '../../../lib/form-errors.ts';
import { useUpdateCartLine } from '../api/update-cart-line.ts';

export function QuantityForm({ lineId, quantity, label }: { lineId: string; quantity: number; label: string }) {
  const toast = useToast();
  const update = useUpdateCartLine();
  const { register, handleSubmit, setError, formState } = useForm<UpdateCartLineInput>({
    resolver: zodResolver(updateCartLineSchema),
    values: { quantity },
  });
  const onSubmit = handleSubmit(async (v) => {
    try {
      await update.mutateAsync({ lineId, quantity: v.quantity });
    } catch (e) {
      const m = applyServerErrors(e, setError, ['quantity']);
      if (m) toast.error(m);
    }
  });
  const err = formState.errors.quantity?.message;
  return (
    <form noValidate onSubmit={onSubmit} className="flex flex-wrap items-end gap-2">
      <div className="flex flex-col gap-1">
        <label htmlFor={`qty-${lineId}`} className="text-sm font-bold">
          Quantity <span className="sr-only">of {label}</span>
        </label>
        <input
          id={`qty-${lineId}`}
          type="number"
          inputMode="numeric"
          min={1}
          max={MAX_LINE_QUANTITY}
          aria-invalid={err ? true : undefined}
          aria-describedby={err ? `qty-${lineId}-error` : undefined}
          className={`min-h-11 w-20 rounded-lg border-2 bg-white px-3 text-base ${err ? 'border-danger' : 'border-field'}`}
          {...register('quantity', { valueAsNumber: true })}
        />
      </div>
      {formState.isDirty ? (
        <Button type="submit" variant="secondary" pending={update.isPending} className="min-h-11 px-3">
          Update
        </Button>
      ) : null}
      {err ? (
        <p id={`qty-${lineId}-error`} className="w-full text-sm font-semibold text-danger">
          {err}
        </p>
      ) : null}
    </form>
  );
}
