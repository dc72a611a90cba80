import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ChartsView } from '../../../../shared/schemas/business.ts';
import { api } from '../../../lib/api-client.ts';
import { businessKeys } from './keys.ts';

export async function getCharts(signal?: AbortSignal): Promise<ChartsView> {
  return api.get<ChartsView>('/api/business/charts', { signal });
}

export const getChartsQueryOptions = () => queryOptions({ queryKey: businessKeys.charts(), queryFn: ({ signal }) => getCharts(signal) });

export function useCharts() {
  return useQuery(getChartsQueryOptions());
}
