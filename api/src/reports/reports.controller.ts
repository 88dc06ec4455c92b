import { Controller, Get, Param, ParseUUIDPipe, Query, StreamableFile } from '@nestjs/common';
import { ApiOkResponse, ApiOperation, ApiProduces, ApiQuery, ApiTags } from '@nestjs/swagger';
import {
  type ClientReport,
  type ClientReportQuery,
  clientReportQuerySchema,
  clientReportSchema,
  DEFAULT_REPORT_DAYS,
  type ReportPaperQuery,
  reportPaperQuerySchema,
  type VersionReport,
  versionReportSchema,
} from '@keyloom/shared';
import { CurrentActor } from '../auth/decorators/current-user.decorator';
import { Roles } from '../auth/decorators/roles.decorator';
import type { Actor } from '../auth/session-user';
import { zodSchemaObject } from '../common/openapi/zod-schema-object';
import { ZodValidationPipe } from '../common/pipes/zod-validation.pipe';
import { type ReportFile, ReportsService } from './reports.service';

const WHO = 'Owning clinician or supervisor; carers 403. Unknown id, or a client out of sight: 404.';
const VERSION_WHO = `${WHO} A version not trained (draft, training, failed): 409.`;
const PERIOD = `from and to (YYYY-MM-DD), both optional: the last ${DEFAULT_REPORT_DAYS} days up to today by default; to before from: 400.`;
const PAPER = 'paper: a4 (default, 595×842 pt) or letter (612×792 pt).';

const pdf = (file: ReportFile): StreamableFile =>
  new StreamableFile(file.bytes, {
    type: 'application/pdf',
    length: file.bytes.length,
    disposition: `attachment; filename="${file.fileName}"`,
  });

@ApiTags('reports')
@Controller()
export class ReportsController {
  constructor(private readonly reports: ReportsService) {}

  @Get('profile-versions/:id/report')
  @Roles('clinician', 'supervisor')
  @ApiOperation({
    summary: 'A trained version’s report, as the print view shows it',
    description: VERSION_WHO,
  })
  @ApiOkResponse({ schema: zodSchemaObject(versionReportSchema) })
  versionReport(
    @CurrentActor() actor: Actor,
    @Param('id', ParseUUIDPipe) id: string,
  ): Promise<VersionReport> {
    return this.reports.versionReport(actor, id);
  }

  @Get('profile-versions/:id/report.pdf')
  @Roles('clinician', 'supervisor')
  @ApiOperation({
    summary: 'Download a trained version’s report as a PDF',
    description: `${VERSION_WHO} ${PAPER} Audited as a download.`,
  })
  @ApiQuery({ name: 'paper', required: false, enum: ['a4', 'letter'] })
  @ApiProduces('application/pdf')
  @ApiOkResponse({ schema: { type: 'string', format: 'binary' } })
  async versionPdf(
    @CurrentActor() actor: Actor,
    @Param('id', ParseUUIDPipe) id: string,
    @Query(new ZodValidationPipe(reportPaperQuerySchema)) query: ReportPaperQuery,
  ): Promise<StreamableFile> {
    return pdf(await this.reports.versionPdf(actor, id, query));
  }

  @Get('clients/:id/report')
  @Roles('clinician', 'supervisor')
  @ApiOperation({
    summary: 'A client’s report over a period, as the print view shows it',
    description: `${WHO} ${PERIOD}`,
  })
  @ApiQuery({ name: 'from', required: false })
  @ApiQuery({ name: 'to', required: false })
  @ApiOkResponse({ schema: zodSchemaObject(clientReportSchema) })
  clientReport(
    @CurrentActor() actor: Actor,
    @Param('id', ParseUUIDPipe) id: string,
    @Query(new ZodValidationPipe(clientReportQuerySchema)) query: ClientReportQuery,
  ): Promise<ClientReport> {
    return this.reports.clientReport(actor, id, query);
  }

  @Get('clients/:id/report.pdf')
  @Roles('clinician', 'supervisor')
  @ApiOperation({
    summary: 'Download a client’s report over a period as a PDF',
    description: `${WHO} ${PERIOD} ${PAPER} Audited as a download.`,
  })
  @ApiQuery({ name: 'from', required: false })
  @ApiQuery({ name: 'to', required: false })
  @ApiQuery({ name: 'paper', required: false, enum: ['a4', 'letter'] })
  @ApiProduces('application/pdf')
  @ApiOkResponse({ schema: { type: 'string', format: 'binary' } })
  async clientPdf(
    @CurrentActor() actor: Actor,
    @Param('id', ParseUUIDPipe) id: string,
    @Query(new ZodValidationPipe(clientReportQuerySchema)) query: ClientReportQuery,
  ): Promise<StreamableFile> {
    return pdf(await this.reports.clientPdf(actor, id, query));
  }
}
