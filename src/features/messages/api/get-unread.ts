import { queryOptions, useQuery } from '@tanstack/react-query';
import type { UnreadView } from '../../../../shared/schemas/message.ts';
import { api } from '../../../lib/api-client.ts';
import { messageKeys } from './keys.ts';

/** GET /api/messages/unread: messages waiting for the signed-in user, for the header. */
export const getUnread = (signal?: AbortSignal) => api.get<UnreadView>('/api/messages/unread', { signal, redirectOn401: false });

/** Asked again every two minutes while a page is open, and whenever the window gets focus. */
export const getUnreadQueryOptions = () => queryOptions({ queryKey: messageKeys.unread(), queryFn: ({ signal }) => getUnread(signal), refetchInterval: 120_000 });

export function useUnread(enabled: boolean) {
  return useQuery({ ...getUnreadQueryOptions(), enabled });
}
