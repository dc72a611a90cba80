import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';
import { workroomKeys } from './keys.ts';

/** Discards a batch none of whose sheets is cut: its lines go back to approved. */
export const discardBatch = (batchId: string) => api.post<{ batchId: string; linesReleased: string[] }>(`/api/workroom/batches/${encodeURIComponent(batchId)}/discard`);
export function useDiscardBatch() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: discardBatch, onSuccess: () => qc.invalidateQueries({ queryKey: workroomKeys.all }) });
}
