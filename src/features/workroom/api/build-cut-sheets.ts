import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Grouping, WorkSheet } from '../../../../shared/schemas/workroom.ts';
import { api } from '../../../lib/api-client.ts';
import { workroomKeys } from './keys.ts';

export type BuildCutSheetsArgs = { lineIds: string[]; grouping?: Grouping; weedingLines?: boolean };
export const buildCutSheets = (args: string[] | BuildCutSheetsArgs) => api.post<{ batchId: string; sheets: WorkSheet[] }>('/api/workroom/cut-sheets', Array.isArray(args) ? { lineIds: args } : args);
export function useBuildCutSheets() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: buildCutSheets, onSuccess: () => qc.invalidateQueries({ queryKey: workroomKeys.all }) });
}
