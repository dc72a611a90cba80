import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { PriceCheckInput, PriceCheckResult } from '../../../../shared/schemas/business.ts';
import { api } from '../../../lib/api-client.ts';
import { businessKeys } from './keys.ts';

export async function priceCheck(input: PriceCheckInput, signal?: AbortSignal): Promise<PriceCheckResult> {
  return api.post<PriceCheckResult>('/api/business/price-check', input, { signal });
}

/** A read-only calculation, so a query (cached per input) rather than a mutation. */
export const getPriceCheckQueryOptions = (input: PriceCheckInput | null) =>
  queryOptions({
    queryKey: businessKeys.priceCheck(input),
    queryFn: ({ signal }) => priceCheck(input!, signal),
    enabled: input !== null,
    placeholderData: keepPreviousData,
    retry: false,
  });

export function usePriceCheck(input: PriceCheckInput | null) {
  return useQuery(getPriceCheckQueryOptions(input));
}
