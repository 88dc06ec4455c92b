import { applyDecorators, Controller, Get, Query, StreamableFile } from '@nestjs/common';
import { ApiOkResponse, ApiOperation, ApiProduces, ApiQuery, ApiTags } from '@nestjs/swagger';
import {
  type AuditFilter,
  auditFilterSchema,
  type AuditPage,
  auditPageSchema,
  type AuditQuery,
  auditQuerySchema,
} from '@keyloom/shared';
import { Roles } from '../auth/decorators/roles.decorator';
import { zodSchemaObject } from '../common/openapi/zod-schema-object';
import { ZodValidationPipe } from '../common/pipes/zod-validation.pipe';
import { AuditLogService } from './audit-log.service';

/** The filters both routes take (OpenAPI). */
const AuditFilterQueries = () =>
  applyDecorators(
    ApiQuery({ name: 'clientId', required: false, schema: { type: 'string', format: 'uuid' } }),
    ApiQuery({
      name: 'userId',
      required: false,
      schema: { type: 'string', format: 'uuid' },
      description: 'the actor',
    }),
    ApiQuery({
      name: 'action',
      required: false,
      schema: { type: 'string' },
      description: 'exact ("sample.upload") or a prefix ending in "." ("sample.")',
    }),
    ApiQuery({
      name: 'from',
      required: false,
      schema: { type: 'string', format: 'date' },
      description: 'first day',
    }),
    ApiQuery({
      name: 'to',
      required: false,
      schema: { type: 'string', format: 'date' },
      description: 'last day',
    }),
  );

@ApiTags('audit')
@Controller()
@Roles('supervisor', 'admin')
export class AuditLogController {
  constructor(private readonly log: AuditLogService) {}

  @Get('audit')
  @ApiOperation({
    summary: 'Browse the audit log, newest first (supervisor, admin)',
    description: 'The log is append-only; no route changes or deletes an event.',
  })
  @AuditFilterQueries()
  @ApiQuery({ name: 'page', required: false, schema: { type: 'integer', minimum: 1, default: 1 } })
  @ApiQuery({
    name: 'pageSize',
    required: false,
    schema: { type: 'integer', minimum: 1, maximum: 200, default: 50 },
  })
  @ApiOkResponse({ schema: zodSchemaObject(auditPageSchema) })
  find(@Query(new ZodValidationPipe(auditQuerySchema)) query: AuditQuery): Promise<AuditPage> {
    return this.log.find(query);
  }

  @Get('audit.csv')
  @ApiOperation({
    summary: 'Every event matching the filters as CSV, newest first (supervisor, admin)',
    description:
      'Columns time (ISO), person, role, action, sentence, client; the same filters and words as GET /api/audit. ' +
      "UTF-8 with a byte order mark; a cell starting with = + - @ is prefixed with '.",
  })
  @AuditFilterQueries()
  @ApiProduces('text/csv')
  @ApiOkResponse({ schema: { type: 'string' } })
  async csv(@Query(new ZodValidationPipe(auditFilterSchema)) filter: AuditFilter): Promise<StreamableFile> {
    // The byte order mark lets spreadsheets read the file as UTF-8.
    const bytes = Buffer.from(`\ufeff${await this.log.csv(filter)}`, 'utf8');
    return new StreamableFile(bytes, {
      type: 'text/csv; charset=utf-8',
      length: bytes.length,
      disposition: 'attachment; filename="audit-log.csv"',
    });
  }
}
