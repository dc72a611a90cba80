import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { WorkLine } from '../../../../shared/schemas/workroom.ts';
import { api } from '../../../lib/api-client.ts';
import { workroomKeys } from './keys.ts';

/** Approves one or several proofs at once (all or nothing). */
export const approveProofs = async (lineIds: string[]) => (await api.post<{ lines: WorkLine[] }>('/api/workroom/proofs/approve', { lineIds })).lines;
export function useApproveProofs() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: approveProofs, onSuccess: () => qc.invalidateQueries({ queryKey: workroomKeys.all }) });
}
