import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';
import { moderationKeys } from './keys.ts';
import type { ModerationQueue } from './types.ts';

export const getQueue = (signal?: AbortSignal) => api.get<ModerationQueue>('/api/moderation/queue', { signal });

export const getQueueQueryOptions = () => queryOptions({ queryKey: moderationKeys.queue(), queryFn: ({ signal }) => getQueue(signal), staleTime: 5_000 });

export function useModerationQueue() {
  return useQuery(getQueueQueryOptions());
}
