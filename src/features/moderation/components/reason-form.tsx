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
  presets,
}: {
  label: string;
  hint?: string;
  submitLabel: string;
  onSubmit: (reason: string) => Promise<unknown>;
  onCancel?: () => void;
  danger?: boolean;
  /** ready-made reasons: a click puts the text in the field, to send as it is or edit */
  presets?: readonly { short: string; text: string }[];
}) {
  const { register, handleSubmit, formState, setError, setValue } = useForm<{ reason: string }>({ resolver: zodResolver(reasonSchema), defaultValues: { reason: '' } });
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
      {presets?.length ? (
        <fieldset className="flex flex-col gap-1.5">
          <legend className="mb-1 text-sm font-bold">Common reasons</legend>
          <div className="flex flex-wrap gap-2">
            {presets.map((p) => (
              <Button key={p.short} variant="secondary" className="min-h-9 px-3 py-1 text-sm" onClick={() => setValue('reason', p.text, { shouldValidate: formState.isSubmitted })}>
                {p.short}
              </Button>
            ))}
          </div>
        </fieldset>
      ) : null}
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
