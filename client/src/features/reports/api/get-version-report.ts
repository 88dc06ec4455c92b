import { type VersionReport, versionReportSchema } from '@keyloom/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiRequest } from '@/lib/api-client';
import { reportKeys } from './keys';

/** A trained version's report as the print view shows it (the PDF holds the same). */
export const getVersionReport = (versionId: string, signal?: AbortSignal): Promise<VersionReport> =>
  apiRequest(`/profile-versions/${encodeURIComponent(versionId)}/report`, {
    schema: versionReportSchema,
    signal,
  });

export const versionReportQueryOptions = (versionId: string) =>
  queryOptions({
    queryKey: reportKeys.version(versionId),
    queryFn: ({ signal }) => getVersionReport(versionId, signal),
  });

export const useVersionReport = (versionId: string) => useQuery(versionReportQueryOptions(versionId));
