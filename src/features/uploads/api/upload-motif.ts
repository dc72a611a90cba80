import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { DroppedReport, MotifView } from '../../../../shared/schemas/upload.ts';
import { upload } from '../../../lib/api-client.ts';
import { uploadKeys } from './keys.ts';

export async function uploadMotif({ name, file, onProgress }: { name: string; file: File; onProgress?: (f: number | null) => void }) {
  const form = new FormData();
  form.append('name', name);
  form.append('file', file);
  return upload<{ motif: MotifView; dropped: DroppedReport }>('/api/motifs', form, onProgress);
}

export function useUploadMotif() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: uploadMotif, onSuccess: () => queryClient.invalidateQueries({ queryKey: uploadKeys.motifs() }) });
}
