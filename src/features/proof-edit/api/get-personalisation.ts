import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Choices } from '../../../../shared/schemas/listing.ts';
import { api } from '../../../lib/api-client.ts';
import { proofEditKeys } from './keys.ts';

export type EditableTextField = { id: string; label: string; maxLength: number; required: boolean; fonts: Array<{ id: string; label: string }>; colours: Array<{ id: string; label: string; hex: string }> };
export type PersonalisationEdit = {
  line: { id: string; orderId: string; state: string; listingTitle: string; version: number };
  editable: boolean;
  changeRequest: string | null;
  choices: Choices;
  textFields: EditableTextField[];
};

export const getPersonalisation = (lineId: string, signal?: AbortSignal) => api.get<PersonalisationEdit>(`/api/order-lines/${encodeURIComponent(lineId)}/personalisation`, { signal });
export const getPersonalisationQueryOptions = (lineId: string) => queryOptions({ queryKey: proofEditKeys.line(lineId), queryFn: ({ signal }) => getPersonalisation(lineId, signal) });
export const usePersonalisation = (lineId: string, enabled = true) => useQuery({ ...getPersonalisationQueryOptions(lineId), enabled });
