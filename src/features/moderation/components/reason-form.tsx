import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { reasonSchema } from '../../../../shared/schemas/catalog.ts';
import { Button } from '../../../components/ui/button.tsx';
import { TextAreaField } from '../../../components/ui/form-controls.tsx';
import { applyServerErrors } from '../../../lib/form-errors.ts';

/** A required reason (sent to the seller by e-mail and kept in the audit log). */
export function ReasonForm({
  label,
  hint = 'The seller receives this by e-mail. It is also kept in the audit log.',
  submitLabel,
  onSubmit,
  onCancel,
  danger = false,
}: {
  label: string;
  hint?: string;
  submitLabel: string;
  onSubmit: (reason: string) => Promise<unknown>;
  onCancel?: () => void;
  danger?: boolean;
}) {
  const { register, handleSubmit, formState, setError } = useForm<{ reason: string }>({ resolver: zodResolver(reasonSchema), defaultValues: { reason: '' } });
  return (
    <form
      noValidate
      className="flex flex-col gap-3"
      onSubmit={handleSubmit(async ({ reason }) => {
        try {
          await onSubmit(reason);
        } catch (error) {
          const message = applyServerErrors(error, setError, ['reason']);
          if (message) setError('reason', { type: 'server', message });
        }
      })}
    >
      <TextAreaField label={label} hint={hint} rows={3} maxLength={1000} autoFocus error={formState.errors.reason?.message} {...register('reason')} />
      <div className="flex flex-wrap gap-3">
        <Button type="submit" variant={danger ? 'secondary' : 'primary'} pending={formState.isSubmitting} className={danger ? 'border-danger text-danger hover:bg-danger-wash' : ''}>
          {submitLabel}
        </Button>
        {onCancel ? (
          <Button variant="quiet" onClick={onCancel}>
            Cancel
          </Button>
        ) : null}
      </div>
    </form>
  );
}
