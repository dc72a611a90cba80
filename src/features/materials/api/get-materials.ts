import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Material } from '../../../../shared/schemas/material.ts';
import { api } from '../../../lib/api-client.ts';
import { materialKeys } from './keys.ts';

/** The shop's materials; `archived` undefined lists both. */
export async function getMaterials(filters: { archived?: boolean }, signal?: AbortSignal): Promise<Material[]> {
  const qs = filters.archived === undefined ? '' : `?archived=${filters.archived}`;
  return (await api.get<{ materials: Material[] }>(`/api/materials${qs}`, { signal })).materials;
}

export const getMaterialsQueryOptions = (filters: { archived?: boolean } = {}) =>
  queryOptions({ queryKey: materialKeys.list(filters), queryFn: ({ signal }) => getMaterials(filters, signal) });

export function useMaterials(filters: { archived?: boolean } = {}) {
  return useQuery(getMaterialsQueryOptions(filters));
}
