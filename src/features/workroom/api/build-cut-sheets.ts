import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { WorkSheet } from '../../../../shared/schemas/workroom.ts';
import { api } from '../../../lib/api-client.ts';
import { workroomKeys } from './keys.ts';

export const buildCutSheets = (lineIds: string[]) => api.post<{ batchId: string; sheets: WorkSheet[] }>('/api/workroom/cut-sheets', { lineIds });
export function useBuildCutSheets() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: buildCutSheets, onSuccess: () => qc.invalidateQueries({ queryKey: workroomKeys.all }) });
}
