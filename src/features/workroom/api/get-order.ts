import { queryOptions, useQuery } from '@tanstack/react-query';
import type { WorkOrder } from '../../../../shared/schemas/workroom.ts';
import { api } from '../../../lib/api-client.ts';
import { workroomKeys } from './keys.ts';

export const getOrder = async (id: string, signal?: AbortSignal) => (await api.get<{ order: WorkOrder }>(`/api/workroom/orders/${encodeURIComponent(id)}`, { signal })).order;
export const getOrderQueryOptions = (id: string) => queryOptions({ queryKey: workroomKeys.order(id), queryFn: ({ signal }) => getOrder(id, signal) });
export const useOrder = (id: string) => useQuery(getOrderQueryOptions(id));
