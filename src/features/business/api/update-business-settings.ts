import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { BusinessSettings, BusinessSettingsInput } from '../../../../shared/schemas/business.ts';
import { api } from '../../../lib/api-client.ts';
import { businessKeys } from './keys.ts';

export async function updateBusinessSettings(input: BusinessSettingsInput): Promise<BusinessSettings> {
  return (await api.patch<{ settings: BusinessSettings }>('/api/business/settings', input)).settings;
}

/** Saving the calendar moves ship-by dates, so every business view is refreshed. */
export function useUpdateBusinessSettings() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateBusinessSettings,
    onSuccess: (settings) => {
      queryClient.setQueryData(businessKeys.settings(), settings);
      void queryClient.invalidateQueries({ queryKey: businessKeys.all });
    },
  });
}
