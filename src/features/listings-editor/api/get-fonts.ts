import { queryOptions, useQuery } from '@tanstack/react-query';
import { type FontInfo, fontListSchema } from '../../../../shared/schemas/engine.ts';
import { api } from '../../../lib/api-client.ts';
import { fontKeys } from './keys.ts';

export async function getFonts(signal?: AbortSignal): Promise<FontInfo[]> {
  return fontListSchema.parse(await api.get<unknown>('/api/fonts', { signal }));
}

export const getFontsQueryOptions = () => queryOptions({ queryKey: fontKeys.list(), queryFn: ({ signal }) => getFonts(signal), staleTime: 60 * 60_000 });

export function useFonts() {
  return useQuery(getFontsQueryOptions());
}
