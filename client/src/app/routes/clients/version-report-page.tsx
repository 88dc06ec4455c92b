import { useParams } from 'react-router-dom';
import { profileVersionPath } from '@/config/paths';
import { useVersionReport } from '@/features/reports/api/get-version-report';
import { ReportPageFrame } from '@/features/reports/components/report-page-frame';
import { VersionReportView } from '@/features/reports/components/version-report-view';
import { versionReportPdfUrl } from '@/features/reports/lib/report-urls';

/** /clients/:clientId/profiles/:versionId/report — a trained version's report, laid out for printing. */
export const VersionReportRoute = () => {
  const { clientId = '', versionId = '' } = useParams();
  return (
    <ReportPageFrame
      report={useVersionReport(versionId)}
      fallbackTitle="Version report"
      back={{ to: profileVersionPath(clientId, versionId), label: 'Back to the version' }}
      title={(data) => `Version ${data.version.number} report: ${data.client.pseudonym}`}
      pdfUrl={() => versionReportPdfUrl(versionId)}
    >
      {(data) => <VersionReportView report={data} />}
    </ReportPageFrame>
  );
};
