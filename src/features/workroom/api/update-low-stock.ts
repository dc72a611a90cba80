import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { LowStockInput, StockView } from '../../../../shared/schemas/workroom.ts';
import { apiRequest } from '../../../lib/api-client.ts';
import { workroomKeys } from './keys.ts';

export const updateLowStock = ({ materialId, ...body }: LowStockInput & { materialId: string }) =>
  apiRequest<StockView>(`/api/workroom/stock/${encodeURIComponent(materialId)}`, { method: 'PATCH', body });
export function useUpdateLowStock() {
  const qc = useQueryClient();
  // the answer is the first page; every page shows the roll, so every stock page is fetched again
  return useMutation({ mutationFn: updateLowStock, onSuccess: () => qc.invalidateQueries({ queryKey: workroomKeys.stocks() }) });
}
