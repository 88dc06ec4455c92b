import { useMutation } from '@tanstack/react-query';
import { z } from 'zod';
import { env } from '@/config/env';
import { apiRequest } from '@/lib/api-client';

// The API's answer is read loosely: what the file holds is shown field by field, and any
// problem list it names is shown as such.
export const exportCheckSchema = z.record(z.string(), z.unknown());
export type ExportCheck = z.infer<typeof exportCheckSchema>;

/** Sends an exported profile file to be checked; the answer describes its contents or what is wrong. */
export const verifyProfileExport = (file: File): Promise<ExportCheck> => {
  const body = new FormData();
  body.append('file', file);
  return apiRequest('/profile-exports/verify', { method: 'POST', body, schema: exportCheckSchema });
};

export const useVerifyProfileExport = () => useMutation({ mutationFn: verifyProfileExport });

/** Where a version's export file downloads from (a plain link: the browser saves it). */
export const profileExportUrl = (versionId: string): string =>
  `${env.API_URL}/profile-versions/${encodeURIComponent(versionId)}/export`;
