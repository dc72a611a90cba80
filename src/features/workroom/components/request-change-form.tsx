import { zodResolver } from '@hookform/resolvers/zod';
import { useId } from 'react';
import { useForm } from 'react-hook-form';
import { type RequestChangeInput, requestChangeSchema } from '../../../../shared/schemas/workroom.ts';
import { Button } from '../../../components/ui/button.tsx';
import { useToast } from '../../../components/ui/toast.tsx';
import { applyServerErrors } from '../../../lib/form-errors.ts';
import { useRequestChange } from '../api/request-change.ts';

/** Asks the shopper to fix the personalisation; they get an e-mail with a link to their order. */
export function RequestChangeForm({ lineId, onDone }: { lineId: string; onDone?: () => void }) {
  const id = useId();
  const toast = useToast();
  const request = useRequestChange();
  const form = useForm<RequestChangeInput>({ resolver: zodResolver(requestChangeSchema), defaultValues: { message: '' } });
  const error = form.formState.errors.message?.message;
  const onSubmit = form.handleSubmit(async (values) => {
    try {
      await request.mutateAsync({ lineId, ...values });
      toast.success('Sent. The shopper has an e-mail with a link to edit the personalisation.');
      form.reset();
      onDone?.();
    } catch (e) {
      const msg = applyServerErrors(e, form.setError, ['message']);
      if (msg) toast.error(msg);
    }
  });
  return (
    <form noValidate onSubmit={onSubmit} className="flex flex-col gap-2">
      <label htmlFor={id} className="font-bold">
        Message to the shopper
      </label>
      <p id={`${id}-hint`} className="text-sm text-ink-soft">
        Say what to check or change, e.g. “Is it Mira or Myra?”. It goes out by e-mail.
      </p>
      <textarea
        id={id}
        rows={3}
        aria-describedby={`${id}-hint${error ? ` ${id}-err` : ''}`}
        aria-invalid={error ? true : undefined}
        className={`w-full rounded-lg border-2 bg-white px-3 py-2 ${error ? 'border-danger' : 'border-field hover:border-ink'}`}
        {...form.register('message')}
      />
      {error ? (
        <p id={`${id}-err`} className="text-sm font-semibold text-danger">
          {error}
        </p>
      ) : null}
      <Button type="submit" variant="secondary" pending={request.isPending} pendingLabel="Sending…" className="self-start">
        Ask for a change
      </Button>
    </form>
  );
}
