import type { PageInput } from '../../../../shared/schemas/pagination.ts';
import type { LinesFilter } from '../../../../shared/schemas/workroom.ts';

export const workroomKeys = {
  all: ['workroom'] as const,
  summary: () => [...workroomKeys.all, 'summary'] as const,
  lines: (q: Partial<LinesFilter> & PageInput = {}) => [...workroomKeys.all, 'lines', { ...q, page: q.page ?? 1 }] as const,
  order: (id: string) => [...workroomKeys.all, 'order', id] as const,
  proof: (lineId: string) => [...workroomKeys.all, 'proof', lineId] as const,
  batches: () => [...workroomKeys.all, 'batches'] as const,
  batch: (id: string) => [...workroomKeys.all, 'batch', id] as const,
  pressCards: () => [...workroomKeys.all, 'press-cards'] as const,
  stocks: () => [...workroomKeys.all, 'stock'] as const,
  stock: (p: PageInput = {}) => [...workroomKeys.stocks(), { page: p.page ?? 1, limit: p.limit ?? null }] as const,
  worksheet: (jobId: string) => [...workroomKeys.all, 'worksheet', jobId] as const,
};
