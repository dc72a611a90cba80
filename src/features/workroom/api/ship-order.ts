import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { ShipInput, WorkOrder } from '../../../../shared/schemas/workroom.ts';
import { api } from '../../../lib/api-client.ts';
import { workroomKeys } from './keys.ts';

export const shipOrder = async ({ orderId, ...body }: ShipInput & { orderId: string }) =>
  (await api.post<{ order: WorkOrder }>(`/api/workroom/orders/${encodeURIComponent(orderId)}/ship`, body)).order;
export function useShipOrder() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: shipOrder, onSuccess: () => qc.invalidateQueries({ queryKey: workroomKeys.all }) });
}
