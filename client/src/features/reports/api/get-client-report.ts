import { type ClientReport, clientReportSchema } from '@keyloom/shared';
import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { apiRequest } from '@/lib/api-client';
import { reportKeys } from './keys';

/** The period asked for; either end may be left out (the API fills in the last 90 days). */
export type ReportPeriodQuery = { from?: string; to?: string };

/** A client's report over a period as the print view shows it (the PDF holds the same). */
export const getClientReport = (
  clientId: string,
  period: ReportPeriodQuery,
  signal?: AbortSignal,
): Promise<ClientReport> => {
  const query = new URLSearchParams();
  if (period.from) query.set('from', period.from);
  if (period.to) query.set('to', period.to);
  const search = query.size > 0 ? `?${query.toString()}` : '';
  return apiRequest(`/clients/${encodeURIComponent(clientId)}/report${search}`, {
    schema: clientReportSchema,
    signal,
  });
};

export const clientReportQueryOptions = (clientId: string, period: ReportPeriodQuery) =>
  queryOptions({
    queryKey: reportKeys.client(clientId, period),
    queryFn: ({ signal }) => getClientReport(clientId, period, signal),
    // Another period keeps the page (and focus in its form) while the new report loads.
    placeholderData: keepPreviousData,
  });

export const useClientReport = (clientId: string, period: ReportPeriodQuery) =>
  useQuery(clientReportQueryOptions(clientId, period));
