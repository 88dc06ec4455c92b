import { type ClinicSettings, clinicSettingsSchema } from '@keyloom/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiRequest } from '@/lib/api-client';
import { clinicKeys } from './keys';

/** The clinic's name, phone, address, e-mail and website (any signed-in staff). */
export const getClinicSettings = (signal?: AbortSignal): Promise<ClinicSettings> =>
  apiRequest('/clinic-settings', { schema: clinicSettingsSchema, signal });

export const clinicSettingsQueryOptions = () =>
  queryOptions({
    queryKey: clinicKeys.settings(),
    queryFn: ({ signal }) => getClinicSettings(signal),
  });

export const useClinicSettings = () => useQuery(clinicSettingsQueryOptions());
