import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { BlankStockInput, BlankTypeInput, SellerBlankType } from '../../../../shared/schemas/blanks.ts';
import { api } from '../../../lib/api-client.ts';

export const blankKeys = { all: ['blanks'] as const, list: () => [...blankKeys.all, 'list'] as const };

/** GET /api/seller/blanks: the shop's blank types with their stock grids. */
export const getBlankTypes = async (signal?: AbortSignal) => (await api.get<{ blankTypes: SellerBlankType[] }>('/api/seller/blanks', { signal })).blankTypes;
export const blankTypesQueryOptions = () => queryOptions({ queryKey: blankKeys.list(), queryFn: ({ signal }) => getBlankTypes(signal) });
export const useBlankTypes = () => useQuery(blankTypesQueryOptions());

/** POST (new) or PUT (edit) a blank type. */
export function useSaveBlankType() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: async ({ id, input }: { id?: string; input: BlankTypeInput }) =>
      (id ? await api.put<{ blankType: SellerBlankType }>(`/api/seller/blanks/${encodeURIComponent(id)}`, input) : await api.post<{ blankType: SellerBlankType }>('/api/seller/blanks', input))
        .blankType,
    onSuccess: () => qc.invalidateQueries({ queryKey: blankKeys.all }),
  });
}

/** PUT /api/seller/blanks/:id/stock */
export function useSetBlankStock() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: async ({ id, input }: { id: string; input: BlankStockInput }) => (await api.put<{ blankType: SellerBlankType }>(`/api/seller/blanks/${encodeURIComponent(id)}/stock`, input)).blankType,
    onSuccess: () => qc.invalidateQueries({ queryKey: blankKeys.all }),
  });
}
