import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { api } from '../../../lib/api-client.ts';

export const siteConfigKeys = { all: ['site-config'] as const };

// Only the client reads this shape, so the schema lives with its one reader.
const siteConfigSchema = z.object({
  demoMode: z.boolean(),
  demoPassword: z.string().optional(),
  demoAccounts: z.array(z.object({ email: z.string(), role: z.string(), label: z.string() })).optional(),
});
export type SiteConfig = z.infer<typeof siteConfigSchema>;

export async function getSiteConfig(signal?: AbortSignal): Promise<SiteConfig> {
  return siteConfigSchema.parse(await api.get<unknown>('/api/config', { signal, redirectOn401: false }));
}

export const getSiteConfigQueryOptions = () => queryOptions({ queryKey: siteConfigKeys.all, queryFn: ({ signal }) => getSiteConfig(signal), staleTime: Infinity });

export function useSiteConfig() {
  return useQuery(getSiteConfigQueryOptions());
}
