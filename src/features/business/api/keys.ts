import type { LedgerQuery } from '../../../../shared/schemas/business.ts';

export const businessKeys = {
  all: ['business'] as const,
  settings: () => [...businessKeys.all, 'settings'] as const,
  due: (today?: string) => [...businessKeys.all, 'due', { today }] as const,
  costs: () => [...businessKeys.all, 'costs'] as const,
  ledger: (q: LedgerQuery) => [...businessKeys.all, 'ledger', q] as const,
  charts: () => [...businessKeys.all, 'charts'] as const,
  priceCheck: (input: unknown) => [...businessKeys.all, 'price-check', input] as const,
};
