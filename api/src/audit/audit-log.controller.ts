import { Controller, Get, Query } from '@nestjs/common';
import { ApiOkResponse, ApiOperation, ApiQuery, ApiTags } from '@nestjs/swagger';
import { type AuditPage, auditPageSchema, type AuditQuery, auditQuerySchema } from '@keyloom/shared';
import { Roles } from '../auth/decorators/roles.decorator';
import { zodSchemaObject } from '../common/openapi/zod-schema-object';
import { ZodValidationPipe } from '../common/pipes/zod-validation.pipe';
import { AuditLogService } from './audit-log.service';

@ApiTags('audit')
@Controller('audit')
@Roles('supervisor', 'admin')
export class AuditLogController {
  constructor(private readonly log: AuditLogService) {}

  @Get()
  @ApiOperation({
    summary: 'Browse the audit log, newest first (supervisor, admin)',
    description: 'The log is append-only; no route changes or deletes an event.',
  })
  @ApiQuery({ name: 'clientId', required: false, schema: { type: 'string', format: 'uuid' } })
  @ApiQuery({
    name: 'userId',
    required: false,
    schema: { type: 'string', format: 'uuid' },
    description: 'the actor',
  })
  @ApiQuery({
    name: 'action',
    required: false,
    schema: { type: 'string' },
    description: 'exact ("sample.upload") or a prefix ending in "." ("sample.")',
  })
  @ApiQuery({
    name: 'from',
    required: false,
    schema: { type: 'string', format: 'date' },
    description: 'first day',
  })
  @ApiQuery({
    name: 'to',
    required: false,
    schema: { type: 'string', format: 'date' },
    description: 'last day',
  })
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
}
