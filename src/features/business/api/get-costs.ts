import { queryOptions, useQuery } from '@tanstack/react-query';
import type { CostsView } from '../../../../shared/schemas/business.ts';
import { api } from '../../../lib/api-client.ts';
import { businessKeys } from './keys.ts';

export async function getCosts(signal?: AbortSignal): Promise<CostsView> {
  return api.get<CostsView>('/api/business/costs', { signal });
}

export const getCostsQueryOptions = () => queryOptions({ queryKey: businessKeys.costs(), queryFn: ({ signal }) => getCosts(signal) });

export function useCosts() {
  return useQuery(getCostsQueryOptions());
}
