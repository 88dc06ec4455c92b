import { ConflictException, Injectable } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import {
  type ClientReport,
  type ClientReportQuery,
  profileReportSchema,
  profileVersionStatusLabels,
  reportCautions,
  reportDate,
  reportFigures,
  type VersionFigure,
  versionFigures,
  type VersionReport,
} from '@keyloom/shared';
import { DataSource, type EntityManager } from 'typeorm';
import { AuditService } from '../audit/audit.service';
import type { Actor } from '../auth/session-user';
import { ClientAccessService } from '../clients/client-access.service';
import type { Client } from '../clients/client.entity';
import { loadClinicSettings } from '../clinic/clinic-settings.service';
import { ProfileVersion } from '../profile-versions/profile-version.entity';
import { ProfileVersionsService, slug, WITH_MODEL } from '../profile-versions/profile-versions.service';
import { savingsBySlotsChart } from '../summaries/summary-chart';
import { summaryCharts } from '../summaries/summary-message';
import { figuresFromMetrics } from '../summaries/summary-text';
import { countTrials, plausibleTrials } from '../summaries/trial-figures';
import { renderClientReportPdf, renderVersionReportPdf, type ReportPdfOptions } from './report-pdf';

export const NOT_TRAINED_REPORT_MESSAGE =
  'This version has not been trained, so it has no results to report yet. Train it first, then print its report.';

/** A PDF ready to send: its bytes and a file name safe in a Content-Disposition header. */
export type ReportFile = { fileName: string; bytes: Buffer };

/** The figures of a stored report; none for a version without one (a base-only version) or an unreadable one. */
function figuresOf(metrics: Record<string, unknown> | null): VersionFigure[] {
  const parsed = metrics ? profileReportSchema.safeParse(metrics) : null;
  return parsed?.success ? versionFigures(parsed.data) : [];
}

const figureValue = (figures: VersionFigure[], key: VersionFigure['key']): string | null =>
  figures.find((f) => f.key === key)?.value ?? null;

const dayOf = (date: Date | null | undefined): string | null => reportDate(date ?? null);

type ReportTrials = { count: number; meanWpm: string | null; notes: string[] };

/**
 * Per version, the trials on the test keyboard (finished within the period, when one is given) that
 * the family summaries would count too: short trials and implausible speeds are left out, with a
 * note saying why (the same rules and words: summaries/trial-figures.ts).
 */
async function reportTrials(
  manager: EntityManager,
  versions: readonly Pick<ProfileVersion, 'id' | 'number' | 'metrics' | 'settings'>[],
  period: { from: string; to: string } | null,
): Promise<Map<string, ReportTrials>> {
  const counted = await countTrials(
    manager,
    versions.map((v) => v.id),
    period,
  );
  const out = new Map<string, ReportTrials>();
  for (const v of versions) {
    const trials = counted.get(v.id);
    if (!trials) continue;
    const notes: string[] = [];
    const wpmWith = reportFigures(v.metrics, v.settings.slots).wpmWith;
    const kept = plausibleTrials({ number: v.number, wpmWith }, trials, notes);
    out.set(v.id, {
      count: kept?.count ?? 0,
      meanWpm: kept?.wpm == null ? null : kept.wpm.toFixed(1),
      notes,
    });
  }
  return out;
}

/**
 * The printed reports: a trained version's report and a client's report over a period, as data for
 * the print view and as PDFs. Clinician (own caseload) and supervisor; carers 403 (the controller's
 * roles, and the `samples` reading here).
 */
@Injectable()
export class ReportsService {
  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    private readonly access: ClientAccessService,
    private readonly versions: ProfileVersionsService,
    private readonly audit: AuditService,
  ) {}

  /** The report of a trained version; 409 for one not trained (draft, training, failed). */
  async versionReport(actor: Actor, id: string): Promise<VersionReport> {
    const { clientId } = await this.versions.readable(actor, id);
    const client = await this.access.requireReadable(actor, clientId, 'samples');
    const manager = this.dataSource.manager;
    const version = await manager.getRepository(ProfileVersion).findOneOrFail({
      where: { id },
      relations: { createdBy: true, signedOffBy: true, approvedBy: true },
    });
    if (!WITH_MODEL.includes(version.status)) throw new ConflictException(NOT_TRAINED_REPORT_MESSAGE);
    const trainedEvent = [...version.history].reverse().find((e) => e.status === 'training');
    const trials = (await reportTrials(manager, [version], null)).get(id) ?? {
      count: 0,
      meanWpm: null,
      notes: [],
    };
    const savings = version.metrics?.keystrokeSavings;
    const savingsPerSlot =
      savings && typeof savings === 'object' && Object.keys(savings).length > 0
        ? (savings as Record<string, number>)
        : null;
    const chart = savingsPerSlot ? savingsBySlotsChart(savingsPerSlot) : null;
    return {
      ...(await this.letterhead(manager, client)),
      version: {
        id: version.id,
        number: version.number,
        status: version.status,
        statusLabel: profileVersionStatusLabels[version.status],
        createdBy: version.createdBy?.name ?? '(removed account)',
        createdOn: dayOf(version.createdAt) ?? '—',
        trainedBy: trainedEvent?.by ?? null,
        trainedOn: dayOf(version.trainedAt),
      },
      trail: [
        { step: 'Trained', by: trainedEvent?.by ?? null, on: dayOf(version.trainedAt) },
        {
          step: 'Signed off by the carer',
          by: version.signedOffById ? (version.signedOffBy?.name ?? '(removed account)') : null,
          on: dayOf(version.signedOffAt),
        },
        {
          step: 'Approved by the supervisor',
          by: version.approvedById ? (version.approvedBy?.name ?? '(removed account)') : null,
          on: dayOf(version.approvedAt),
        },
      ],
      figures: figuresOf(version.metrics),
      chart: chart && { svg: chart.svg, width: chart.width, height: chart.height, alt: chart.alt },
      trials,
      samples: version.samples.map(({ title, characters }) => ({ title, characters })),
    };
  }

  /** The client's report over a period: versions trained or approved in it, the summary charts, trials. */
  async clientReport(actor: Actor, clientId: string, query: ClientReportQuery): Promise<ClientReport> {
    const client = await this.access.requireReadable(actor, clientId, 'samples');
    const manager = this.dataSource.manager;
    const versions = await manager
      .getRepository(ProfileVersion)
      .createQueryBuilder('v')
      .where('v.clientId = :clientId', { clientId })
      .andWhere('v.status IN (:...statuses)', { statuses: WITH_MODEL })
      .andWhere(
        '(CAST(v.trained_at AS date) BETWEEN :from AND :to OR CAST(v.approved_at AS date) BETWEEN :from AND :to)',
        { from: query.from, to: query.to },
      )
      .orderBy('v.number', 'ASC')
      .getMany();
    const trials = await reportTrials(manager, versions, query);
    const rows = versions.map((v) => {
      const figures = figuresOf(v.metrics);
      return {
        id: v.id,
        number: v.number,
        statusLabel: profileVersionStatusLabels[v.status],
        trainedOn: dayOf(v.trainedAt),
        approvedOn: dayOf(v.approvedAt),
        slots: v.settings.slots,
        keystrokeSavings: figureValue(figures, 'keystrokeSavings'),
        hitRate: figureValue(figures, 'hitRate'),
        wpm: figureValue(figures, 'wpm'),
      };
    });
    const charts = summaryCharts(
      versions.map((v) =>
        figuresFromMetrics(
          {
            number: v.number,
            status: v.status,
            date: null,
            slots: v.settings.slots,
            baseOnly: v.baseOnly,
          },
          v.metrics,
        ),
      ),
    ).map(({ svg, width, height, alt }) => ({ svg, width, height, alt }));
    return {
      ...(await this.letterhead(manager, client)),
      period: {
        from: query.from,
        to: query.to,
        fromOn: reportDate(query.from) ?? query.from,
        toOn: reportDate(query.to) ?? query.to,
      },
      versions: rows,
      charts,
      trials: versions.flatMap((v) => {
        const t = trials.get(v.id);
        return t ? [{ versionNumber: v.number, ...t }] : [];
      }),
    };
  }

  /** The version report as a PDF, audited as a download. */
  async versionPdf(actor: Actor, id: string, options: ReportPdfOptions): Promise<ReportFile> {
    const report = await this.versionReport(actor, id);
    const bytes = await renderVersionReportPdf(report, options);
    await this.audit.record(
      actor,
      'report.version-pdf',
      { type: 'profile-version', id, clientId: report.client.id },
      { number: report.version.number, paper: options.paper, bytes: bytes.length },
    );
    return {
      fileName: `keyloom-${slug(report.client.pseudonym)}-version-${report.version.number}.pdf`,
      bytes,
    };
  }

  /** The client report as a PDF, audited as a download. */
  async clientPdf(actor: Actor, clientId: string, query: ClientReportQuery): Promise<ReportFile> {
    const report = await this.clientReport(actor, clientId, query);
    const bytes = await renderClientReportPdf(report, { paper: query.paper });
    await this.audit.record(
      actor,
      'report.client-pdf',
      { type: 'client', id: clientId, clientId },
      { from: query.from, to: query.to, paper: query.paper, bytes: bytes.length },
    );
    return {
      fileName: `keyloom-${slug(report.client.pseudonym)}-${query.from}-to-${query.to}.pdf`,
      bytes,
    };
  }

  /** The clinic, the client, today's date and the cautions: the top and tail of every report. */
  private async letterhead(manager: EntityManager, client: Client) {
    const clinic = await loadClinicSettings(manager);
    return {
      clinic: { name: clinic.name, address: clinic.address || null, phone: clinic.phone || null },
      client: { id: client.id, pseudonym: client.pseudonym },
      printedOn: reportDate(new Date()) ?? '',
      cautions: [...reportCautions],
    };
  }
}
