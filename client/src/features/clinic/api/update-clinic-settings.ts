import { type ClinicSettings, clinicSettingsSchema, type UpdateClinicSettingsInput } from '@keyloom/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from '@/lib/api-client';
import { clinicKeys } from './keys';

/** Sets every clinic detail at once (admin only). */
export const updateClinicSettings = (changes: UpdateClinicSettingsInput): Promise<ClinicSettings> =>
  apiRequest('/clinic-settings', { method: 'PUT', body: changes, schema: clinicSettingsSchema });

export const useUpdateClinicSettings = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateClinicSettings,
    onSuccess: (saved) => {
      queryClient.setQueryData(clinicKeys.settings(), saved);
      return queryClient.invalidateQueries({ queryKey: clinicKeys.all });
    },
  });
};
