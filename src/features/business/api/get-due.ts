import { queryOptions, useQuery } from '@tanstack/react-query';
import type { DueView } from '../../../../shared/schemas/business.ts';
import { api } from '../../../lib/api-client.ts';
import { businessKeys } from './keys.ts';

/** Open lines with their ship-by date and mark (`due_today`, `at_risk`, `late`), most urgent first. */
export async function getDue(today?: string, signal?: AbortSignal): Promise<DueView> {
  return api.get<DueView>(`/api/business/due${today ? `?today=${encodeURIComponent(today)}` : ''}`, { signal });
}

export const getDueQueryOptions = (today?: string) => queryOptions({ queryKey: businessKeys.due(today), queryFn: ({ signal }) => getDue(today, signal) });

export function useDue(today?: string) {
  return useQuery(getDueQueryOptions(today));
}
