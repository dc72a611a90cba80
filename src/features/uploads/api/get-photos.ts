import { queryOptions, useQuery } from '@tanstack/react-query';
import type { UploadView } from '../../../../shared/schemas/upload.ts';
import { api } from '../../../lib/api-client.ts';
import { uploadKeys } from './keys.ts';

export async function getPhotos(signal?: AbortSignal): Promise<UploadView[]> {
  return (await api.get<{ uploads: UploadView[] }>('/api/uploads', { signal })).uploads;
}

export const getPhotosQueryOptions = () => queryOptions({ queryKey: uploadKeys.photos(), queryFn: ({ signal }) => getPhotos(signal) });

export function usePhotos() {
  return useQuery(getPhotosQueryOptions());
}
