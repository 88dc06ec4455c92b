import { type ProfileFileCheck, profileFileCheckSchema } from '@keyloom/shared';
import { useMutation } from '@tanstack/react-query';
import { env } from '@/config/env';
import { apiRequest } from '@/lib/api-client';

/**
 * Sends an exported profile file to be checked. The answer says whether this clinic signed it and
 * what it holds; a damaged file is an ApiError (400) saying what is wrong.
 */
export const verifyProfileExport = (file: File): Promise<ProfileFileCheck> => {
  const body = new FormData();
  body.append('file', file);
  return apiRequest('/profile-exports/verify', { method: 'POST', body, schema: profileFileCheckSchema });
};

export const useVerifyProfileExport = () => useMutation({ mutationFn: verifyProfileExport });

/** Where a version's export file downloads from (a plain link: the browser saves it). */
export const profileExportUrl = (versionId: string): string =>
  `${env.API_URL}/profile-versions/${encodeURIComponent(versionId)}/export`;
