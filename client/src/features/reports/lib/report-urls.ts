import { env } from '@/config/env';

/** The API's PDF of a trained version's report (A4). */
export const versionReportPdfUrl = (versionId: string): string =>
  `${env.API_URL}/profile-versions/${encodeURIComponent(versionId)}/report.pdf`;

/** The API's PDF of a client's report over a period (A4). */
export const clientReportPdfUrl = (clientId: string, period: { from: string; to: string }): string =>
  `${env.API_URL}/clients/${encodeURIComponent(clientId)}/report.pdf?from=${encodeURIComponent(period.from)}&to=${encodeURIComponent(period.to)}`;
