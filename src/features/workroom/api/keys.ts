import type { LineState } from '../../../../shared/schemas/order.ts';

export const workroomKeys = {
  all: ['workroom'] as const,
  summary: () => [...workroomKeys.all, 'summary'] as const,
  lines: (state?: LineState) => [...workroomKeys.all, 'lines', state ?? 'all'] as const,
  order: (id: string) => [...workroomKeys.all, 'order', id] as const,
  proof: (lineId: string) => [...workroomKeys.all, 'proof', lineId] as const,
  batches: () => [...workroomKeys.all, 'batches'] as const,
  batch: (id: string) => [...workroomKeys.all, 'batch', id] as const,
  pressCards: () => [...workroomKeys.all, 'press-cards'] as const,
  stock: () => [...workroomKeys.all, 'stock'] as const,
  worksheet: (jobId: string) => [...workroomKeys.all, 'worksheet', jobId] as const,
};
