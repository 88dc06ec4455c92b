import { useParams, useSearchParams } from 'react-router-dom';
import { LiveRegion } from '@/components/ui/live-region';
import { clientPath } from '@/config/paths';
import { useClientReport } from '@/features/reports/api/get-client-report';
import { ClientReportView } from '@/features/reports/components/client-report-view';
import { ReportPageFrame } from '@/features/reports/components/report-page-frame';
import { ReportPeriodForm } from '@/features/reports/components/report-period-form';
import { clientReportPdfUrl } from '@/features/reports/lib/report-urls';

/** /clients/:clientId/report?from&to — a client's report over a period (the last 90 days by default). */
export const ClientReportRoute = () => {
  const { clientId = '' } = useParams();
  const [search, setSearch] = useSearchParams();
  const report = useClientReport(clientId, {
    from: search.get('from') ?? undefined,
    to: search.get('to') ?? undefined,
  });
  return (
    <ReportPageFrame
      report={report}
      fallbackTitle="Client report"
      back={{ to: clientPath(clientId), label: 'Back to the client' }}
      title={(data) => `Client report: ${data.client.pseudonym}`}
      pdfUrl={(data) => clientReportPdfUrl(clientId, data.period)}
    >
      {(data) => (
        <>
          {/* After another period is chosen (focus stays in the form), say which one is shown. */}
          <LiveRegion
            message={
              search.has('from') && !report.isPlaceholderData
                ? { tone: 'success', text: `Showing ${data.period.fromOn} to ${data.period.toOn}.` }
                : null
            }
          />
          <div className="flex flex-col gap-8">
            <ReportPeriodForm
              period={data.period}
              onApply={(next) => setSearch(next, { state: { keepFocus: true } })}
            />
            <ClientReportView report={data} />
          </div>
        </>
      )}
    </ReportPageFrame>
  );
};
