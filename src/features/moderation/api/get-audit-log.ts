import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { type PageInput, pageSearch } from '../../../../shared/schemas/pagination.ts';
import { api } from '../../../lib/api-client.ts';
import { moderationKeys } from './keys.ts';
import type { AuditPage } from './types.ts';

/** GET /api/moderation/audit: decisions, newest first, a page at a time. */
type AuditInput = PageInput & { action?: string | undefined };

export const getAuditLog = (p: AuditInput, signal?: AbortSignal) => {
  const search = pageSearch(p);
  if (p.action) search.set('action', p.action);
  const qs = search.toString();
  return api.get<AuditPage>(`/api/moderation/audit${qs ? `?${qs}` : ''}`, { signal });
};

export const getAuditLogQueryOptions = (p: AuditInput = {}) =>
  queryOptions({ queryKey: moderationKeys.audit(p), queryFn: ({ signal }) => getAuditLog(p, signal), placeholderData: keepPreviousData, staleTime: 5_000 });

export function useAuditLog(p: AuditInput = {}) {
  return useQuery(getAuditLogQueryOptions(p));
}
