import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Material, UpdateMaterialInput } from '../../../../shared/schemas/material.ts';
import { api } from '../../../lib/api-client.ts';
import { materialKeys } from './keys.ts';

export async function updateMaterial({ id, input }: { id: string; input: UpdateMaterialInput }): Promise<Material> {
  return (await api.patch<{ material: Material }>(`/api/materials/${encodeURIComponent(id)}`, input)).material;
}

export function useUpdateMaterial() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: updateMaterial, onSuccess: () => queryClient.invalidateQueries({ queryKey: materialKeys.all }) });
}
