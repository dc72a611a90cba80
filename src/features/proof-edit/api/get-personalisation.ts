import { queryOptions, useQuery } from '@tanstack/react-query';
import type { PersonalisationEdit } from '../../../../shared/schemas/workroom.ts';
import { api } from '../../../lib/api-client.ts';
import { proofEditKeys } from './keys.ts';

export type { EditableTextField, PersonalisationEdit } from '../../../../shared/schemas/workroom.ts';

export const getPersonalisation = (lineId: string, signal?: AbortSignal) => api.get<PersonalisationEdit>(`/api/order-lines/${encodeURIComponent(lineId)}/personalisation`, { signal });
export const getPersonalisationQueryOptions = (lineId: string) => queryOptions({ queryKey: proofEditKeys.line(lineId), queryFn: ({ signal }) => getPersonalisation(lineId, signal) });
export const usePersonalisation = (lineId: string, enabled = true) => useQuery({ ...getPersonalisationQueryOptions(lineId), enabled });
