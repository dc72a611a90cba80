import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { UploadView } from '../../../../shared/schemas/upload.ts';
import { upload } from '../../../lib/api-client.ts';
import { uploadKeys } from './keys.ts';

export async function uploadPhoto({ file, onProgress }: { file: File; onProgress?: (f: number | null) => void }): Promise<UploadView> {
  const form = new FormData();
  // fields before the file, so the server has them when the file arrives
  form.append('kind', 'photo');
  form.append('file', file);
  return (await upload<{ upload: UploadView }>('/api/uploads', form, onProgress)).upload;
}

export function useUploadPhoto() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: uploadPhoto, onSuccess: () => queryClient.invalidateQueries({ queryKey: uploadKeys.photos() }) });
}
