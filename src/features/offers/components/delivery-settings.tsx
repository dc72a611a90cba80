import { type FormEvent, useState } from 'react';
import { orderByDateSchema, shippingDaysSchema } from '../../../../shared/schemas/offers.ts';
import { Button } from '../../../components/ui/button.tsx';
import { FormSection } from '../../../components/ui/form-controls.tsx';
import { QueryBoundary } from '../../../components/ui/query-boundary.tsx';
import { TextField } from '../../../components/ui/text-field.tsx';
import { useToast } from '../../../components/ui/toast.tsx';
import { isApiError } from '../../../lib/api-client.ts';
import { type DeliverySettings as Settings, useAddOrderByDate, useDeleteOrderByDate, useDeliverySettings, useSaveShippingDays } from '../api/offers-api.ts';

/** The shop's days in the post (behind needed-by dates) and its order-by dates per occasion. */
export function DeliverySettings() {
  const q = useDeliverySettings();
  return (
    <QueryBoundary query={q} loading="Loading your dates…">
      {(data) => <Body s={data} />}
    </QueryBoundary>
  );
}

function Body({ s }: { s: Settings }) {
  const toast = useToast();
  const saveDays = useSaveShippingDays();
  const add = useAddOrderByDate();
  const del = useDeleteOrderByDate();
  const [days, setDays] = useState(String(s.shippingDays));
  const [daysError, setDaysError] = useState<string>();
  const [occasion, setOccasion] = useState('');
  const [orderBy, setOrderBy] = useState('');
  const [errs, setErrs] = useState<Record<string, string>>({});

  const onDays = async (ev: FormEvent) => {
    ev.preventDefault();
    const p = shippingDaysSchema.safeParse({ shippingDays: days.trim() === '' ? Number.NaN : Number(days) });
    if (!p.success) return setDaysError(p.error.issues[0]?.message);
    setDaysError(undefined);
    await saveDays.mutateAsync(p.data.shippingDays).then(
      () => toast.success('Days in the post saved.'),
      (e) => setDaysError(isApiError(e) ? (e.fields?.shippingDays ?? e.message) : 'Something went wrong.'),
    );
  };
  const onAdd = async (ev: FormEvent) => {
    ev.preventDefault();
    const p = orderByDateSchema.safeParse({ occasion, orderBy });
    if (!p.success) return setErrs(Object.fromEntries(p.error.issues.map((i) => [String(i.path[0]), i.message])));
    setErrs({});
    try {
      await add.mutateAsync(p.data);
      setOccasion('');
      setOrderBy('');
      toast.success('The banner shows on your listings until that day.');
    } catch (e) {
      if (isApiError(e) && e.fields) setErrs(e.fields);
      else toast.error(isApiError(e) ? e.message : 'Something went wrong.');
    }
  };

  return (
    <div className="grid gap-6 lg:grid-cols-2">
      <form noValidate onSubmit={onDays}>
        <FormSection
          title="Days in the post"
          lead={`Your own estimate, in working days (Monday to Friday). With your ${s.processingDays} processing days it tells shoppers whether you can make their needed-by date.`}
        >
          <TextField label="Working days in the post" inputMode="numeric" value={days} onChange={(e) => setDays(e.target.value)} error={daysError} className="max-w-56" />
          <Button type="submit" className="self-start" pending={saveDays.isPending} pendingLabel="Saving…">
            Save
          </Button>
        </FormSection>
      </form>
      <form noValidate onSubmit={onAdd}>
        <FormSection title="Order-by dates" lead="A banner on every listing of your shop until the day passes.">
          <ul className="flex flex-col gap-2">
            {s.orderBy.map((o) => (
              <li key={o.id} className="flex items-center justify-between gap-2 rounded-lg border border-line px-3 py-2">
                <span>
                  Order by <strong>{o.orderBy}</strong> for {o.occasion}
                </span>
                <Button variant="quiet" pending={del.isPending && del.variables === o.id} onClick={() => del.mutate(o.id, { onError: (e) => toast.error(e.message) })}>
                  Delete <span className="sr-only">{o.occasion}</span>
                </Button>
              </li>
            ))}
          </ul>
          <div className="grid gap-4 sm:grid-cols-2">
            <TextField label="Occasion" value={occasion} onChange={(e) => setOccasion(e.target.value)} error={errs.occasion} maxLength={60} />
            <TextField label="Order by" type="date" value={orderBy} onChange={(e) => setOrderBy(e.target.value)} error={errs.orderBy} />
          </div>
          <Button type="submit" className="self-start" pending={add.isPending} pendingLabel="Adding…">
            Add date
          </Button>
        </FormSection>
      </form>
    </div>
  );
}
