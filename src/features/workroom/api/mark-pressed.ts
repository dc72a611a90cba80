import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { WorkLine } from '../../../../shared/schemas/workroom.ts';
import { api } from '../../../lib/api-client.ts';
import { workroomKeys } from './keys.ts';

export const markPressed = async (lineIds: string[]) => (await api.post<{ lines: WorkLine[] }>('/api/workroom/pressed', { lineIds })).lines;
export function useMarkPressed() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: markPressed, onSuccess: () => qc.invalidateQueries({ queryKey: workroomKeys.all }) });
}
