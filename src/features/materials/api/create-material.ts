import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CreateMaterialInput, Material } from '../../../../shared/schemas/material.ts';
import { api } from '../../../lib/api-client.ts';
import { materialKeys } from './keys.ts';

export async function createMaterial(input: CreateMaterialInput): Promise<Material> {
  return (await api.post<{ material: Material }>('/api/materials', input)).material;
}

export function useCreateMaterial() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: createMaterial, onSuccess: () => queryClient.invalidateQueries({ queryKey: materialKeys.all }) });
}
