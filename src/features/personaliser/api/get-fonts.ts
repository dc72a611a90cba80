import { queryOptions, useQuery } from '@tanstack/react-query';
import { type FontInfo, fontListSchema } from '../../../../shared/schemas/engine.ts';
import { api } from '../../../lib/api-client.ts';
import { personaliserKeys } from './keys.ts';

/** GET /api/fonts: the bundled fonts, each with the URL of its exact TTF and the characters it draws. */
export async function getFonts(signal?: AbortSignal): Promise<FontInfo[]> {
  return fontListSchema.parse(await api.get<unknown>('/api/fonts', { signal }));
}

export const getFontsQueryOptions = () => queryOptions({ queryKey: personaliserKeys.fonts(), queryFn: ({ signal }) => getFonts(signal), staleTime: Infinity });

export function useFonts() {
  return useQuery(getFontsQueryOptions());
}
