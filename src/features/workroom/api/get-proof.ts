import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Proof } from '../../../../shared/schemas/workroom.ts';
import { api } from '../../../lib/api-client.ts';
import { workroomKeys } from './keys.ts';

export const getProof = async (lineId: string, signal?: AbortSignal) => (await api.get<{ proof: Proof }>(`/api/workroom/lines/${encodeURIComponent(lineId)}/proof`, { signal })).proof;
export const getProofQueryOptions = (lineId: string) => queryOptions({ queryKey: workroomKeys.proof(lineId), queryFn: ({ signal }) => getProof(lineId, signal) });
export const useProof = (lineId: string) => useQuery(getProofQueryOptions(lineId));
