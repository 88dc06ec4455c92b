import type { UseQueryResult } from '@tanstack/react-query';
import type { ReactNode } from 'react';
import { Link } from 'react-router-dom';
import { PageLoading } from '@/components/layout/page-loading';
import { LoadError } from '@/components/ui/load-error';
import { PageHeader } from '@/components/ui/page-header';
import { ReportToolbar } from './report-parts';

type ReportPageFrameProps<T> = {
  report: UseQueryResult<T>;
  /** The page's title while the report is not there (loading failed). */
  fallbackTitle: string;
  /** Where "back" goes, and its words. */
  back: { to: string; label: string };
  /** The page's title once the report is there. */
  title: (report: T) => string;
  /** The API's PDF of this report. */
  pdfUrl: (report: T) => string;
  children: (report: T) => ReactNode;
};

/** A printed report's page: loading, the API's refusal with a retry, or the title, toolbar and report. */
export const ReportPageFrame = <T,>({
  report,
  fallbackTitle,
  back,
  title,
  pdfUrl,
  children,
}: ReportPageFrameProps<T>) => {
  const backLink = (
    <Link to={back.to} className="inline-flex min-h-11 items-center font-bold underline">
      {back.label}
    </Link>
  );
  if (report.isPending) return <PageLoading />;
  if (report.isError) {
    return (
      <>
        <PageHeader title={fallbackTitle} description={backLink} />
        <LoadError
          title="The report could not be made."
          error={report.error}
          onRetry={() => void report.refetch()}
        />
      </>
    );
  }
  return (
    <>
      <PageHeader
        title={title(report.data)}
        description={<ReportToolbar pdfUrl={pdfUrl(report.data)} back={backLink} />}
      />
      {children(report.data)}
    </>
  );
};
