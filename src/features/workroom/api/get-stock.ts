import { queryOptions, useQuery } from '@tanstack/react-query';
import type { StockView } from '../../../../shared/schemas/workroom.ts';
import { api } from '../../../lib/api-client.ts';
import { workroomKeys } from './keys.ts';

export const getStock = (signal?: AbortSignal) => api.get<StockView>('/api/workroom/stock', { signal });
export const getStockQueryOptions = () => queryOptions({ queryKey: workroomKeys.stock(), queryFn: ({ signal }) => getStock(signal) });
export const useStock = () => useQuery(getStockQueryOptions());
