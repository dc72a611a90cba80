import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { Material } from '../../../../shared/schemas/material.ts';
import { PAGE_LIMIT_MAX, type Page, type PageInput, pageCount, pageSearch } from '../../../../shared/schemas/pagination.ts';
import { api } from '../../../lib/api-client.ts';
import { type MaterialFilters, materialKeys } from './keys.ts';

/** GET /api/materials: one page of the shop's materials by kind and colour; `archived` undefined lists both. */
export async function getMaterials(filters: MaterialFilters & PageInput, signal?: AbortSignal): Promise<Page<Material>> {
  const params = pageSearch(filters);
  if (filters.archived !== undefined) params.set('archived', String(filters.archived));
  const qs = params.toString();
  return api.get<Page<Material>>(`/api/materials${qs ? `?${qs}` : ''}`, { signal });
}

export const getMaterialsQueryOptions = (filters: MaterialFilters & PageInput = {}) =>
  queryOptions({ queryKey: materialKeys.list(filters), queryFn: ({ signal }) => getMaterials(filters, signal), placeholderData: keepPreviousData });

export function useMaterials(filters: MaterialFilters & PageInput = {}) {
  return useQuery(getMaterialsQueryOptions(filters));
}

/**
 * Every material of the shop that passes the filter, page after page at the largest page size:
 * for the listing editor's colour pickers, which must offer every roll the shop has.
 */
export async function getAllMaterials(filters: MaterialFilters, signal?: AbortSignal): Promise<Material[]> {
  const first = await getMaterials({ ...filters, page: 1, limit: PAGE_LIMIT_MAX }, signal);
  const rest = await Promise.all(Array.from({ length: pageCount(first.total, first.limit) - 1 }, (_, i) => getMaterials({ ...filters, page: i + 2, limit: PAGE_LIMIT_MAX }, signal)));
  return [first, ...rest].flatMap((p) => p.items);
}

export const getAllMaterialsQueryOptions = (filters: MaterialFilters = {}) => queryOptions({ queryKey: materialKeys.every(filters), queryFn: ({ signal }) => getAllMaterials(filters, signal) });

export function useAllMaterials(filters: MaterialFilters = {}) {
  return useQuery(getAllMaterialsQueryOptions(filters));
}
