import { useMutation } from '@tanstack/react-query';
import type { WorksheetJob, WorksheetRequest } from '../../../../shared/schemas/workroom.ts';
import { api } from '../../../lib/api-client.ts';

/** Starts building the work sheet PDF of a batch; poll the job with useWorksheetJob. */
export const startWorksheet = async ({ batchId, ...body }: WorksheetRequest & { batchId: string }) =>
  (await api.post<{ job: WorksheetJob }>(`/api/workroom/batches/${encodeURIComponent(batchId)}/worksheet`, body)).job;
export const useStartWorksheet = () => useMutation({ mutationFn: startWorksheet });
