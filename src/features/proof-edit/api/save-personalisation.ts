import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { PersonalisationEditInput } from '../../../../shared/schemas/workroom.ts';
import { apiRequest } from '../../../lib/api-client.ts';
import type { PersonalisationEdit } from './get-personalisation.ts';
import { proofEditKeys } from './keys.ts';

export const savePersonalisation = ({ lineId, ...body }: PersonalisationEditInput & { lineId: string }) =>
  apiRequest<PersonalisationEdit>(`/api/order-lines/${encodeURIComponent(lineId)}/personalisation`, { method: 'PUT', body });

/** Saves the edit; the caller also refreshes the order it shows (its key belongs to the orders feature). */
export function useSavePersonalisation(onSaved?: () => void) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: savePersonalisation,
    onSuccess: (data) => {
      qc.setQueryData(proofEditKeys.line(data.line.id), data);
      onSaved?.();
    },
  });
}
