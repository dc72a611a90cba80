import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { LedgerQuery, LedgerView } from '../../../../shared/schemas/business.ts';
import { api } from '../../../lib/api-client.ts';
import { businessKeys } from './keys.ts';

const qs = (q: LedgerQuery) => {
  const p = new URLSearchParams();
  if (q.from) p.set('from', q.from);
  if (q.to) p.set('to', q.to);
  const s = p.toString();
  return s ? `?${s}` : '';
};

export async function getLedger(q: LedgerQuery, signal?: AbortSignal): Promise<LedgerView> {
  return api.get<LedgerView>(`/api/business/ledger${qs(q)}`, { signal });
}

export const getLedgerQueryOptions = (q: LedgerQuery) => queryOptions({ queryKey: businessKeys.ledger(q), queryFn: ({ signal }) => getLedger(q, signal), placeholderData: keepPreviousData });

export function useLedger(q: LedgerQuery) {
  return useQuery(getLedgerQueryOptions(q));
}
