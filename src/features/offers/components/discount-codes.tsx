import { type FormEvent, useState } from 'react';
import { formatMoney } from '../../../../shared/money.ts';
import { DISCOUNT_KIND_LABELS, type DiscountCodeView, type DiscountsView, discountCodeSchema } from '../../../../shared/schemas/offers.ts';
import { Button } from '../../../components/ui/button.tsx';
import { CheckboxField, FormSection, MoneyField, SelectField } from '../../../components/ui/form-controls.tsx';
import { QueryBoundary } from '../../../components/ui/query-boundary.tsx';
import { SimpleTable } from '../../../components/ui/simple-table.tsx';
import { TextField } from '../../../components/ui/text-field.tsx';
import { useToast } from '../../../components/ui/toast.tsx';
import { isApiError } from '../../../lib/api-client.ts';
import { useDeleteCode, useDiscounts, useOwnListings, useSaveCode } from '../api/offers-api.ts';

type Draft = {
  code: string;
  kind: 'percent' | 'amount';
  percentOff: string;
  amountOffMinor: number | undefined;
  minSpendMinor: number | undefined;
  startsOn: string;
  endsOn: string;
  usageLimit: string;
  listingIds: string[];
  active: boolean;
};
const EMPTY: Draft = { code: '', kind: 'percent', percentOff: '', amountOffMinor: undefined, minSpendMinor: 0, startsOn: '', endsOn: '', usageLimit: '', listingIds: [], active: true };

const draftOf = (c: DiscountCodeView): Draft => ({
  code: c.code,
  kind: c.kind,
  percentOff: c.percentOff === null ? '' : String(c.percentOff),
  amountOffMinor: c.amountOffMinor ?? undefined,
  minSpendMinor: c.minSpendMinor,
  startsOn: c.startsOn ?? '',
  endsOn: c.endsOn ?? '',
  usageLimit: c.usageLimit === null ? '' : String(c.usageLimit),
  listingIds: c.listingIds,
  active: c.active,
});

const num = (s: string) => (s.trim() === '' ? null : Number(s));

/** The shop's discount codes: the form (checked by the API's own schema) and the list with what each gave away. */
export function DiscountCodes() {
  const q = useDiscounts();
  return (
    <QueryBoundary query={q} loading="Loading your codes…">
      {(data) => <DiscountCodesBody view={data} />}
    </QueryBoundary>
  );
}

function DiscountCodesBody({ view }: { view: DiscountsView }) {
  const toast = useToast();
  const listings = useOwnListings();
  const save = useSaveCode();
  const del = useDeleteCode();
  const [editing, setEditing] = useState<string | null>(null);
  const [d, setD] = useState<Draft>(EMPTY);
  const [errors, setErrors] = useState<Record<string, string>>({});
  const cur = view.currency;
  const set = <K extends keyof Draft>(k: K, v: Draft[K]) => setD((x) => ({ ...x, [k]: v }));
  const titles = new Map((listings.data?.items ?? []).map((l) => [l.id, l.draft.title]));

  const onSubmit = async (ev: FormEvent) => {
    ev.preventDefault();
    const parsed = discountCodeSchema.safeParse({
      code: d.code,
      kind: d.kind,
      percentOff: d.kind === 'percent' ? num(d.percentOff) : null,
      amountOffMinor: d.kind === 'amount' ? (d.amountOffMinor ?? null) : null,
      minSpendMinor: d.minSpendMinor ?? Number.NaN,
      startsOn: d.startsOn,
      endsOn: d.endsOn,
      usageLimit: num(d.usageLimit),
      listingIds: d.listingIds,
      active: d.active,
    });
    if (!parsed.success) {
      setErrors(Object.fromEntries(parsed.error.issues.map((i) => [String(i.path[0] ?? 'code'), i.message])));
      return;
    }
    setErrors({});
    try {
      await save.mutateAsync({ id: editing, values: parsed.data });
      toast.success(editing ? `${parsed.data.code} saved.` : `${parsed.data.code} is ready to share.`);
      setEditing(null);
      setD(EMPTY);
    } catch (e) {
      if (isApiError(e) && e.fields) setErrors(e.fields);
      else toast.error(isApiError(e) ? e.message : 'Something went wrong. Please try again.');
    }
  };

  return (
    <div className="flex flex-col gap-6">
      <form noValidate onSubmit={onSubmit}>
        <FormSection title={editing ? `Change ${d.code}` : 'New discount code'} lead="Shoppers type it in the cart; it takes money off your items (never shipping).">
          <div className="grid gap-4 sm:grid-cols-2">
            <TextField label="Code" hint="3–20 letters, digits or dashes." value={d.code} onChange={(e) => set('code', e.target.value)} error={errors.code} autoCapitalize="characters" />
            <SelectField label="Kind" value={d.kind} onChange={(e) => set('kind', e.target.value as Draft['kind'])} error={errors.kind}>
              <option value="percent">{DISCOUNT_KIND_LABELS.percent}</option>
              <option value="amount">{DISCOUNT_KIND_LABELS.amount}</option>
            </SelectField>
            {d.kind === 'percent' ? (
              <TextField label="Percent off" inputMode="numeric" value={d.percentOff} onChange={(e) => set('percentOff', e.target.value)} error={errors.percentOff} />
            ) : (
              <MoneyField label="Amount off" currency={cur} value={d.amountOffMinor} onChange={(m) => set('amountOffMinor', m)} error={errors.amountOffMinor} />
            )}
            <MoneyField
              label="Minimum spend"
              hint="On the items the code covers; 0 for none."
              currency={cur}
              value={d.minSpendMinor}
              onChange={(m) => set('minSpendMinor', m)}
              error={errors.minSpendMinor}
            />
            <TextField label="First day" hint="Empty: from now." type="date" value={d.startsOn} onChange={(e) => set('startsOn', e.target.value)} error={errors.startsOn} />
            <TextField label="Last day" hint="Empty: no end." type="date" value={d.endsOn} onChange={(e) => set('endsOn', e.target.value)} error={errors.endsOn} />
            <TextField
              label="Uses allowed"
              hint="Paid checkouts; empty for no limit."
              inputMode="numeric"
              value={d.usageLimit}
              onChange={(e) => set('usageLimit', e.target.value)}
              error={errors.usageLimit}
            />
            <SelectField
              label="Listings"
              hint="None picked: the whole shop. Hold Ctrl or ⌘ to pick several."
              multiple
              value={d.listingIds}
              onChange={(e) =>
                set(
                  'listingIds',
                  [...e.target.selectedOptions].map((o) => o.value),
                )
              }
              error={errors.listingIds}
            >
              {(listings.data?.items ?? []).map((l) => (
                <option key={l.id} value={l.id}>
                  {l.draft.title}
                </option>
              ))}
            </SelectField>
          </div>
          <CheckboxField label="Active" hint="Untick to pause the code without deleting it." checked={d.active} onChange={(e) => set('active', e.target.checked)} />
          <div className="flex flex-wrap gap-3">
            <Button type="submit" pending={save.isPending} pendingLabel="Saving…">
              {editing ? 'Save code' : 'Add code'}
            </Button>
            {editing ? (
              <Button
                variant="quiet"
                onClick={() => {
                  setEditing(null);
                  setD(EMPTY);
                  setErrors({});
                }}
              >
                Cancel
              </Button>
            ) : null}
          </div>
        </FormSection>
      </form>
      <SimpleTable
        caption="Your discount codes"
        columns={['Code', 'Takes off', 'Terms', 'Uses', { header: 'Given away', num: true }, '']}
        minWidthClass="min-w-[44rem]"
        empty={view.codes.length === 0 ? 'No codes yet.' : null}
      >
        {view.codes.map((c) => (
          <tr key={c.id} className="border-t border-line">
            <td className="px-3 py-2 font-bold">
              {c.code}
              {c.active ? null : <span className="ml-2 text-sm font-semibold text-ink-soft">(paused)</span>}
            </td>
            <td className="px-3 py-2">{c.kind === 'percent' ? `${c.percentOff} %` : formatMoney(c.amountOffMinor ?? 0, cur)}</td>
            <td className="px-3 py-2 text-sm">
              {[
                c.minSpendMinor ? `from ${formatMoney(c.minSpendMinor, cur)}` : null,
                c.startsOn || c.endsOn ? `${c.startsOn ?? '…'} to ${c.endsOn ?? '…'}` : null,
                c.listingIds.length ? c.listingIds.map((id) => titles.get(id) ?? 'a listing').join(', ') : 'whole shop',
              ]
                .filter(Boolean)
                .join(' · ')}
            </td>
            <td className="px-3 py-2 tabular-nums">
              {c.usedCount}
              {c.usageLimit !== null ? ` of ${c.usageLimit}` : ''}
              {c.reservedCount ? ` (+${c.reservedCount} paying now)` : ''}
            </td>
            <td className="px-3 py-2 text-right tabular-nums">{formatMoney(c.givenAwayMinor, cur)}</td>
            <td className="px-3 py-2">
              <div className="flex gap-2">
                <Button
                  variant="quiet"
                  onClick={() => {
                    setEditing(c.id);
                    setD(draftOf(c));
                    setErrors({});
                  }}
                >
                  Change <span className="sr-only">{c.code}</span>
                </Button>
                <Button
                  variant="quiet"
                  pending={del.isPending && del.variables === c.id}
                  onClick={() => del.mutate(c.id, { onError: (e) => toast.error(e.message), onSuccess: () => toast.success(`${c.code} deleted.`) })}
                >
                  Delete <span className="sr-only">{c.code}</span>
                </Button>
              </div>
            </td>
          </tr>
        ))}
      </SimpleTable>
    </div>
  );
}

/** The business view's line: what codes took off paid orders. */
export function DiscountsGivenAway() {
  const q = useDiscounts();
  if (!q.data) return null;
  const v = q.data;
  return (
    <section aria-labelledby="given-away-title" className="flex flex-col gap-2 rounded-lg border border-line bg-white p-5">
      <h2 id="given-away-title" className="text-xl font-extrabold">
        What discount codes gave away
      </h2>
      <p data-testid="given-away">
        {formatMoney(v.givenAwayMinor, v.currency)} off {v.ordersWithCode} {v.ordersWithCode === 1 ? 'order' : 'orders'}
        {v.codes.length
          ? `: ${v.codes
              .filter((c) => c.givenAwayMinor > 0)
              .map((c) => `${c.code} ${formatMoney(c.givenAwayMinor, v.currency)}`)
              .join(', ')}`
          : ''}
        . Your margins already count the discounted prices.
      </p>
    </section>
  );
}
