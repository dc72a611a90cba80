import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';
import { messageKeys } from './keys.ts';

/** POST /api/orders/:id/messages/read: the other side's messages in this thread are read. */
export const markRead = (orderId: string) => api.post<{ marked: number }>(`/api/orders/${encodeURIComponent(orderId)}/messages/read`);

export function useMarkRead(orderId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: () => markRead(orderId),
    onSuccess: (r) => {
      if (r.marked > 0) void qc.invalidateQueries({ queryKey: messageKeys.all });
    },
  });
}
