import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { type PageInput, pageSearch } from '../../../../shared/schemas/pagination.ts';
import type { StockView } from '../../../../shared/schemas/workroom.ts';
import { api } from '../../../lib/api-client.ts';
import { workroomKeys } from './keys.ts';

/** GET /api/workroom/stock: every roll in use, and one page of the cut sheets' use (newest first). */
export const getStock = (p: PageInput, signal?: AbortSignal) => {
  const qs = pageSearch(p).toString();
  return api.get<StockView>(`/api/workroom/stock${qs ? `?${qs}` : ''}`, { signal });
};
export const getStockQueryOptions = (p: PageInput = {}) => queryOptions({ queryKey: workroomKeys.stock(p), queryFn: ({ signal }) => getStock(p, signal), placeholderData: keepPreviousData });
export const useStock = (p: PageInput = {}) => useQuery(getStockQueryOptions(p));
