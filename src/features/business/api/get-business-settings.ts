import { queryOptions, useQuery } from '@tanstack/react-query';
import type { BusinessSettings } from '../../../../shared/schemas/business.ts';
import { api } from '../../../lib/api-client.ts';
import { businessKeys } from './keys.ts';

export async function getBusinessSettings(signal?: AbortSignal): Promise<BusinessSettings> {
  return (await api.get<{ settings: BusinessSettings }>('/api/business/settings', { signal })).settings;
}

export const getBusinessSettingsQueryOptions = () => queryOptions({ queryKey: businessKeys.settings(), queryFn: ({ signal }) => getBusinessSettings(signal) });

export function useBusinessSettings() {
  return useQuery(getBusinessSettingsQueryOptions());
}
