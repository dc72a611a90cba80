import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { type PageInput, pageSearch } from '../../../../shared/schemas/pagination.ts';
import type { LinesFilter, WorkLinesPage } from '../../../../shared/schemas/workroom.ts';
import { api } from '../../../lib/api-client.ts';
import { workroomKeys } from './keys.ts';

export type LinesRequest = Partial<LinesFilter> & PageInput;

/** GET /api/workroom/lines: one page of the shop's lines (most urgent first) that pass the filters. */
export const getLines = (q: LinesRequest, signal?: AbortSignal) => {
  const { page, limit, ...filter } = q;
  const params = pageSearch({ page, limit });
  for (const [k, v] of Object.entries(filter)) if (v !== undefined && v !== '') params.set(k, String(v));
  const qs = params.toString();
  return api.get<WorkLinesPage>(`/api/workroom/lines${qs ? `?${qs}` : ''}`, { signal });
};
export const getLinesQueryOptions = (q: LinesRequest = {}) =>
  // the last page stays on screen while the next one loads
  queryOptions({ queryKey: workroomKeys.lines(q), queryFn: ({ signal }) => getLines(q, signal), placeholderData: keepPreviousData });
export const useLines = (q: LinesRequest = {}) => useQuery(getLinesQueryOptions(q));
