import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { MessageView } from '../../../../shared/schemas/message.ts';
import { upload } from '../../../lib/api-client.ts';
import { messageKeys } from './keys.ts';

/** POST /api/orders/:id/messages as multipart: the text, and a photo when one is chosen. */
export function postMessage(orderId: string, body: string, photo: File | null) {
  const form = new FormData();
  form.append('body', body);
  if (photo) form.append('file', photo);
  return upload<{ message: MessageView }>(`/api/orders/${encodeURIComponent(orderId)}/messages`, form);
}

export function usePostMessage(orderId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ body, photo }: { body: string; photo: File | null }) => postMessage(orderId, body, photo),
    onSuccess: () => qc.invalidateQueries({ queryKey: messageKeys.thread(orderId) }),
  });
}
