import { useEffect, useState } from 'react';
import { formatDate } from '../../../../shared/dates.ts';
import { pageCount } from '../../../../shared/schemas/pagination.ts';
import { SHOP_STATES, type ShopState } from '../../../../shared/schemas/shop.ts';
import { StitchedBox } from '../../../components/ui/card.tsx';
import { Badge, SelectField } from '../../../components/ui/form-controls.tsx';
import { Pager, usePageParam } from '../../../components/ui/pager.tsx';
import { QueryBoundary } from '../../../components/ui/query-boundary.tsx';
import { TextField } from '../../../components/ui/text-field.tsx';
import { useShops } from '../api/get-shops.ts';
import { ShopActions } from './shop-actions.tsx';

export const SHOP_STATE_LABELS: Record<ShopState, string> = { in_review: 'In review', live: 'Live', suspended: 'Suspended', rejected: 'Rejected' };

/** Any shop, found by name, web address or owner e-mail, with the moves its state allows. */
export function ShopFinder() {
  const [typed, setTyped] = useState('');
  const [q, setQ] = useState('');
  const [state, setState] = useState<ShopState | ''>('');
  // the directory's page lives in the URL (the desk's queues have their own)
  const [page, setPage] = usePageParam('directoryPage');
  // search a moment after typing stops, not on every key; a new search starts on page 1
  useEffect(() => {
    const t = window.setTimeout(() => {
      const next = typed.trim();
      if (next === q) return;
      setQ(next);
      setPage(1, { replace: true });
    }, 300);
    return () => window.clearTimeout(t);
  }, [typed, q, setPage]);

  const shops = useShops({ q, page, ...(state ? { state } : {}) });
  const pages = shops.data ? pageCount(shops.data.total, shops.data.limit) : 1;

  return (
    <div className="flex flex-col gap-4">
      <search aria-label="Find a shop">
        <form
          className="grid grid-cols-1 gap-3 sm:grid-cols-[1fr_14rem]"
          onSubmit={(e) => {
            e.preventDefault();
            setQ(typed.trim());
            setPage(1, { replace: true });
          }}
        >
          <TextField label="Find a shop" hint="Name, web address or owner e-mail" type="search" value={typed} maxLength={100} onChange={(e) => setTyped(e.target.value)} />
          <SelectField
            label="State"
            hint="Which shops to list"
            value={state}
            onChange={(e) => {
              setState(e.target.value as ShopState | '');
              setPage(1, { replace: true });
            }}
          >
            <option value="">All states</option>
            {SHOP_STATES.map((s) => (
              <option key={s} value={s}>
                {SHOP_STATE_LABELS[s]}
              </option>
            ))}
          </SelectField>
        </form>
      </search>

      <QueryBoundary query={shops} loading="Loading shops…">
        {(data) => (
          <>
            <p aria-live="polite" className="text-ink-soft">
              {data.total === 0 ? 'No shops match.' : `${data.total} ${data.total === 1 ? 'shop' : 'shops'}${pages > 1 ? ` · page ${page} of ${pages}` : ''}`}
            </p>
            {data.items.length === 0 ? (
              <StitchedBox>
                <p>No shops match. Try part of the name, or another state.</p>
              </StitchedBox>
            ) : (
              <ul className="grid grid-cols-1 gap-4 md:grid-cols-2">
                {data.items.map((s) => (
                  <li key={s.id} className="flex flex-col gap-3 rounded-lg border border-line bg-white p-4" aria-label={`Shop ${s.name}`}>
                    <div className="flex flex-col gap-1">
                      <div className="flex flex-wrap items-center gap-2">
                        <p className="text-lg font-extrabold break-words">{s.name}</p>
                        <Badge tone={s.state === 'live' ? 'thread' : s.state === 'in_review' ? 'marigold' : 'danger'}>{SHOP_STATE_LABELS[s.state]}</Badge>
                      </div>
                      <p className="text-sm [overflow-wrap:anywhere] text-ink-soft">
                        /shops/{s.slug} · {s.owner.name} ({s.owner.email}) · opened {formatDate(s.createdAt)}
                      </p>
                    </div>
                    {s.stateReason && (s.state === 'suspended' || s.state === 'rejected') ? <p className="text-sm whitespace-pre-wrap">Reason: {s.stateReason}</p> : null}
                    <ShopActions shop={s} />
                  </li>
                ))}
              </ul>
            )}
            <Pager page={page} total={data.total} limit={data.limit} label="Shop list pages" noun="shops" onPageChange={setPage} />
          </>
        )}
      </QueryBoundary>
    </div>
  );
}
