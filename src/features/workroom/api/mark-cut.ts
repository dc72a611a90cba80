import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { MarkCutResult } from '../../../../shared/schemas/workroom.ts';
import { api } from '../../../lib/api-client.ts';
import { workroomKeys } from './keys.ts';

/** Marks one sheet cut, or every sheet of a batch. */
export const markCut = (target: { sheetId: string } | { batchId: string }) =>
  api.post<MarkCutResult>('sheetId' in target ? `/api/workroom/cut-sheets/${encodeURIComponent(target.sheetId)}/cut` : `/api/workroom/batches/${encodeURIComponent(target.batchId)}/cut`);
export function useMarkCut() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: markCut, onSuccess: () => qc.invalidateQueries({ queryKey: workroomKeys.all }) });
}
