import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { Controller, useForm } from 'react-hook-form';
import { SMALL_PART_MM2, type WeedingRates } from '../../../../shared/business/labour.ts';
import { formatMoney } from '../../../../shared/money.ts';
import { type BusinessSettings, type BusinessSettingsInput, businessSettingsSchema } from '../../../../shared/schemas/business.ts';
import { Button } from '../../../components/ui/button.tsx';
import { FieldError, FormSection, MoneyController } from '../../../components/ui/form-controls.tsx';
import { TextField } from '../../../components/ui/text-field.tsx';
import { useToast } from '../../../components/ui/toast.tsx';
import { applyServerErrors } from '../../../lib/form-errors.ts';
import { useUpdateBusinessSettings } from '../api/update-business-settings.ts';

type Values = { workingDays: number[]; daysOff: string[]; hourlyRateMinor: number; weedingRates: WeedingRates; processingDays: number };
const FIELDS = [
  'workingDays',
  'daysOff',
  'hourlyRateMinor',
  'weedingRates.secondsPerPiece',
  'weedingRates.secondsPerCounter',
  'weedingRates.secondsPerSmallPart',
  'weedingRates.secondsPerMetre',
  'processingDays',
] as const;
const RATE_FIELDS = [
  { name: 'secondsPerPiece', label: 'Seconds per piece', hint: 'Weeding around each separate piece of vinyl.' },
  { name: 'secondsPerCounter', label: 'Seconds per counter', hint: 'Picking out each hole inside a letter or shape.' },
  { name: 'secondsPerSmallPart', label: 'Seconds per small part', hint: `Extra for each piece or counter under ${SMALL_PART_MM2} mm².` },
  { name: 'secondsPerMetre', label: 'Seconds per metre of cut line', hint: 'Following the blade’s line around and inside every piece.' },
] as const;
export const WEEKDAYS = [
  { iso: 1, label: 'Monday' },
  { iso: 2, label: 'Tuesday' },
  { iso: 3, label: 'Wednesday' },
  { iso: 4, label: 'Thursday' },
  { iso: 5, label: 'Friday' },
  { iso: 6, label: 'Saturday' },
  { iso: 7, label: 'Sunday' },
];

/** Working weekdays, days off, processing days and the hourly rate used for labour. */
export function BusinessSettingsForm({ settings }: { settings: BusinessSettings }) {
  const toast = useToast();
  const update = useUpdateBusinessSettings();
  const [newDay, setNewDay] = useState('');
  const { control, register, handleSubmit, setError, formState, reset, watch, setValue } = useForm<Values, unknown, BusinessSettingsInput>({
    resolver: zodResolver(businessSettingsSchema) as never,
    defaultValues: {
      workingDays: settings.workingDays,
      daysOff: settings.daysOff,
      hourlyRateMinor: settings.hourlyRateMinor,
      weedingRates: settings.weedingRates,
      processingDays: settings.processingDays,
    },
  });
  const e = formState.errors;
  const daysOff = watch('daysOff');

  const onSubmit = handleSubmit(async (values) => {
    try {
      const saved = await update.mutateAsync(values);
      reset({ workingDays: saved.workingDays, daysOff: saved.daysOff, hourlyRateMinor: saved.hourlyRateMinor, weedingRates: saved.weedingRates, processingDays: saved.processingDays });
      toast.success('Business settings saved. Ship-by dates of open orders follow the new calendar.');
    } catch (error) {
      const message = applyServerErrors(error, setError, FIELDS);
      if (message) toast.error(message);
    }
  });

  const addDay = () => {
    if (!/^\d{4}-\d{2}-\d{2}$/.test(newDay)) return;
    setValue('daysOff', [...new Set([...daysOff, newDay])].sort(), { shouldDirty: true });
    setNewDay('');
  };
  const dayOffError = e.daysOff?.message ?? (Array.isArray(e.daysOff) ? e.daysOff.find((x) => x?.message)?.message : undefined);

  return (
    <form noValidate onSubmit={onSubmit} className="flex flex-col gap-6">
      <FormSection title="Working calendar" lead={`Ship-by dates count your processing days on these weekdays only, skipping your days off. Calendar days are in ${settings.timeZone}.`}>
        <TextField
          label="Processing days"
          hint="Working days from payment to shipping."
          type="number"
          min={1}
          max={60}
          className="max-w-40"
          error={e.processingDays?.message}
          {...register('processingDays', { valueAsNumber: true })}
        />
        <Controller
          control={control}
          name="workingDays"
          render={({ field }) => (
            <fieldset aria-describedby={e.workingDays ? 'working-days-error' : undefined}>
              <legend className="mb-2 font-bold text-ink">Weekdays you work</legend>
              <div className="flex flex-wrap gap-2">
                {WEEKDAYS.map((d) => {
                  const on = field.value.includes(d.iso);
                  return (
                    <label
                      key={d.iso}
                      className={`flex min-h-11 cursor-pointer items-center gap-2 rounded-lg border-2 px-3 font-semibold ${on ? 'border-thread bg-thread-wash text-thread-deep' : 'border-line bg-white text-ink'}`}
                    >
                      <input
                        type="checkbox"
                        className="size-5 accent-[var(--color-thread)]"
                        checked={on}
                        onChange={(ev) => field.onChange(ev.target.checked ? [...field.value, d.iso].sort((a, b) => a - b) : field.value.filter((x) => x !== d.iso))}
                      />
                      {d.label}
                    </label>
                  );
                })}
              </div>
              <FieldError id="working-days-error" message={e.workingDays?.message} />
            </fieldset>
          )}
        />
        <div className="flex flex-col gap-2">
          <div className="flex flex-wrap items-end gap-3">
            <TextField label="Add a day off" hint="Holidays, a market day, time away." type="date" value={newDay} onChange={(ev) => setNewDay(ev.target.value)} className="max-w-56" />
            <Button variant="secondary" onClick={addDay} disabled={!newDay}>
              Add day off
            </Button>
          </div>
          <FieldError id="days-off-error" message={dayOffError} />
          {daysOff.length ? (
            <ul aria-label="Days off" className="flex flex-wrap gap-2">
              {daysOff.map((d) => (
                <li key={d} className="flex items-center gap-1 rounded-full border border-line bg-paper-deep py-0.5 pr-1 pl-3 font-semibold">
                  {d}
                  <button
                    type="button"
                    aria-label={`Remove day off ${d}`}
                    className="flex size-8 items-center justify-center rounded-full hover:bg-danger-wash"
                    onClick={() =>
                      setValue(
                        'daysOff',
                        daysOff.filter((x) => x !== d),
                        { shouldDirty: true },
                      )
                    }
                  >
                    ×
                  </button>
                </li>
              ))}
            </ul>
          ) : (
            <p className="text-ink-soft">No days off yet.</p>
          )}
        </div>
      </FormSection>
      <FormSection
        title="Labour"
        lead="Weeding minutes are estimated from each design's own cut pieces — its pieces, counters, small parts and length of cut line — at your rates below, and costed at your hourly rate."
      >
        <MoneyController control={control} name="hourlyRateMinor" label="Hourly rate" currency={settings.currency} error={e.hourlyRateMinor?.message} className="max-w-56" />
        <div className="grid gap-4 sm:grid-cols-2">
          {RATE_FIELDS.map((f) => (
            <TextField
              key={f.name}
              label={f.label}
              hint={f.hint}
              type="number"
              inputMode="decimal"
              min={0}
              error={e.weedingRates?.[f.name]?.message}
              {...register(`weedingRates.${f.name}`, { valueAsNumber: true })}
            />
          ))}
        </div>
      </FormSection>
      <p className="text-sm text-ink-soft">
        Fees in margins: platform {settings.fees.platformFeeBps / 100} %; payment {settings.fees.paymentFeeBps / 100} % + {formatMoney(settings.fees.paymentFeeFixedMinor, settings.currency)} per
        charge.
      </p>
      <div>
        <Button type="submit" pending={update.isPending} pendingLabel="Saving…">
          Save business settings
        </Button>
      </div>
    </form>
  );
}
