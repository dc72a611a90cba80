import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';
import { materialKeys } from './keys.ts';

export async function deleteMaterial(id: string): Promise<{ deleted: boolean }> {
  return api.delete<{ deleted: boolean }>(`/api/materials/${encodeURIComponent(id)}`);
}

export function useDeleteMaterial() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: deleteMaterial, onSuccess: () => queryClient.invalidateQueries({ queryKey: materialKeys.all }) });
}
