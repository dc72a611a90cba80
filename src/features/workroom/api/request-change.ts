import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { RequestChangeInput, WorkLine } from '../../../../shared/schemas/workroom.ts';
import { api } from '../../../lib/api-client.ts';
import { workroomKeys } from './keys.ts';

export const requestChange = async ({ lineId, ...body }: RequestChangeInput & { lineId: string }) =>
  (await api.post<{ line: WorkLine }>(`/api/workroom/lines/${encodeURIComponent(lineId)}/request-change`, body)).line;
export function useRequestChange() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: requestChange, onSuccess: () => qc.invalidateQueries({ queryKey: workroomKeys.all }) });
}
