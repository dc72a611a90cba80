import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';
import { moderationKeys } from './keys.ts';
import type { AuditPage } from './types.ts';

export const getAuditLog = (page: number, signal?: AbortSignal) => api.get<AuditPage>(`/api/moderation/audit?page=${page}`, { signal });

export const getAuditLogQueryOptions = (page: number) =>
  queryOptions({ queryKey: moderationKeys.audit(page), queryFn: ({ signal }) => getAuditLog(page, signal), placeholderData: keepPreviousData, staleTime: 5_000 });

export function useAuditLog(page: number) {
  return useQuery(getAuditLogQueryOptions(page));
}
