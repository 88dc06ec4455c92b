import {
  Body,
  Controller,
  Delete,
  Get,
  HttpCode,
  Param,
  ParseUUIDPipe,
  Post,
  Req,
  UploadedFiles,
  UseGuards,
  UseInterceptors,
} from '@nestjs/common';
import {
  ApiBody,
  ApiConsumes,
  ApiCreatedResponse,
  ApiNoContentResponse,
  ApiOkResponse,
  ApiOperation,
  ApiTags,
} from '@nestjs/swagger';
import {
  type DeleteSampleInput,
  deleteSampleSchema,
  type ExcludeSampleInput,
  excludeSampleSchema,
  type FlagDecisionInput,
  flagDecisionSchema,
  pasteSampleSchema,
  type SampleDetail,
  sampleDetailSchema,
  type SampleSummary,
  sampleSummarySchema,
  type UploadResult,
  uploadResultSchema,
  uploadSamplesFieldsSchema,
} from '@keyloom/shared';
import type { Request } from 'express';
import { z } from 'zod';
import { CurrentActor } from '../auth/decorators/current-user.decorator';
import { OwnedClientGuard } from '../clients/owned-client.guard';
import type { Actor } from '../auth/session-user';
import { zodSchemaObject } from '../common/openapi/zod-schema-object';
import { parseOrThrow, ZodValidationPipe } from '../common/pipes/zod-validation.pipe';
import { SampleFilesInterceptor } from './sample-files.interceptor';
import { SamplesService } from './samples.service';

// Empty form fields arrive as "": treated as not given.
function withoutEmptyFields(body: unknown): Record<string, unknown> {
  const fields = typeof body === 'object' && body !== null ? (body as Record<string, unknown>) : {};
  return Object.fromEntries(Object.entries(fields).filter(([, value]) => value !== ''));
}

const ACCESS =
  'Owning clinician only (supervisor, admin and carer: 403; another clinician’s or a made-up client: 404).';

@ApiTags('samples')
@Controller()
export class SamplesController {
  constructor(private readonly samples: SamplesService) {}

  @Post('clients/:id/samples')
  // Role and caseload are checked before the body is read (guards run before interceptors).
  @UseGuards(OwnedClientGuard)
  @UseInterceptors(SampleFilesInterceptor)
  @ApiOperation({
    summary: 'Upload language samples (multipart) or paste one (JSON)',
    description:
      `${ACCESS} Needs an active training consent (409). Multipart: field "files" (.txt, .md, .csv; UTF-8 or ` +
      'UTF-16; ≤ SAMPLE_MAX_FILE_MB each → 413; ≤ SAMPLE_MAX_FILES → 400) and the fields of ' +
      'uploadSamplesFieldsSchema (csvColumn names the CSV column that holds the text). JSON: pasteSampleSchema ' +
      '(pasted text ≤ 100 kB of UTF-8, 400 above). A caller who may not upload is refused before the body is ' +
      'read; a multipart body declared larger than the client may hold: 413 unread; without Content-Length: 411. Every file is checked before anything is stored; all are stored in one transaction. ' +
      'Files whose bytes this client already has are listed in "duplicates" and not stored. Over ' +
      'SAMPLE_MAX_CLIENT_MB for the client: 413.',
  })
  @ApiConsumes('multipart/form-data', 'application/json')
  @ApiBody({
    schema: {
      oneOf: [
        {
          type: 'object',
          required: ['files', 'sourceKind'],
          properties: {
            files: { type: 'array', items: { type: 'string', format: 'binary' } },
            ...((zodSchemaObject(uploadSamplesFieldsSchema) as { properties?: object }).properties ?? {}),
          },
        },
        zodSchemaObject(pasteSampleSchema),
      ],
    },
  })
  @ApiCreatedResponse({ schema: zodSchemaObject(uploadResultSchema) })
  upload(
    @CurrentActor() actor: Actor,
    @Param('id', ParseUUIDPipe) id: string,
    @Req() req: Request,
    @UploadedFiles() files: Express.Multer.File[] | undefined,
    @Body() body: unknown,
  ): Promise<UploadResult> {
    if (req.is('multipart/form-data')) {
      const fields = parseOrThrow(uploadSamplesFieldsSchema, withoutEmptyFields(body));
      return this.samples.upload(actor, id, files ?? [], fields);
    }
    return this.samples.paste(actor, id, parseOrThrow(pasteSampleSchema, body));
  }

  @Get('clients/:id/samples')
  @ApiOperation({ summary: 'The client’s language samples, newest first (owning clinician, supervisor)' })
  @ApiOkResponse({ schema: zodSchemaObject(z.array(sampleSummarySchema)) })
  list(@CurrentActor() actor: Actor, @Param('id', ParseUUIDPipe) id: string): Promise<SampleSummary[]> {
    return this.samples.list(actor, id);
  }

  @Get('samples/:id')
  @ApiOperation({
    summary: 'One sample: current text, statistics, flags (owning clinician, supervisor)',
    description: 'Carer and admin: 403. Unknown id or another clinician’s sample: 404.',
  })
  @ApiOkResponse({ schema: zodSchemaObject(sampleDetailSchema) })
  findOne(@CurrentActor() actor: Actor, @Param('id', ParseUUIDPipe) id: string): Promise<SampleDetail> {
    return this.samples.findOne(actor, id);
  }

  @Post('samples/:id/flags/:flagId')
  @HttpCode(200)
  @ApiOperation({
    summary: 'Redact or keep one personal-data flag',
    description:
      `${ACCESS} redact: the span becomes a placeholder token, later flags move, statistics are recounted. ` +
      'keep: needs a reason. A flag decided before: 409. The sample is ready once no flag is open.',
  })
  @ApiBody({ schema: zodSchemaObject(flagDecisionSchema) })
  @ApiOkResponse({ schema: zodSchemaObject(sampleDetailSchema) })
  decide(
    @CurrentActor() actor: Actor,
    @Param('id', ParseUUIDPipe) id: string,
    @Param('flagId', ParseUUIDPipe) flagId: string,
    @Body(new ZodValidationPipe(flagDecisionSchema)) body: FlagDecisionInput,
  ): Promise<SampleDetail> {
    return this.samples.decideFlag(actor, id, flagId, body);
  }

  @Post('samples/:id/exclude')
  @HttpCode(200)
  @ApiOperation({
    summary: 'Leave a sample out for good, with a reason',
    description: `${ACCESS} Twice: 409.`,
  })
  @ApiBody({ schema: zodSchemaObject(excludeSampleSchema) })
  @ApiOkResponse({ schema: zodSchemaObject(sampleSummarySchema) })
  exclude(
    @CurrentActor() actor: Actor,
    @Param('id', ParseUUIDPipe) id: string,
    @Body(new ZodValidationPipe(excludeSampleSchema)) body: ExcludeSampleInput,
  ): Promise<SampleSummary> {
    return this.samples.exclude(actor, id, body);
  }

  @Post('samples/:id/include')
  @HttpCode(200)
  @ApiOperation({
    summary: 'Include a left-out sample again',
    description: `${ACCESS} Not left out: 409. Ready again, or needs review while flags are open.`,
  })
  @ApiOkResponse({ schema: zodSchemaObject(sampleSummarySchema) })
  include(@CurrentActor() actor: Actor, @Param('id', ParseUUIDPipe) id: string): Promise<SampleSummary> {
    return this.samples.include(actor, id);
  }

  @Delete('samples/:id')
  @HttpCode(204)
  @ApiOperation({
    summary: 'Delete a sample uploaded by mistake, with a reason',
    description:
      `${ACCESS} Deletes the text and its flags (and its copy in drafts never trained). Once a version ` +
      'has trained on it: 409 naming the versions (leave it out instead). The log keeps a hash of the reason.',
  })
  @ApiBody({ schema: zodSchemaObject(deleteSampleSchema) })
  @ApiNoContentResponse()
  remove(
    @CurrentActor() actor: Actor,
    @Param('id', ParseUUIDPipe) id: string,
    @Body(new ZodValidationPipe(deleteSampleSchema)) body: DeleteSampleInput,
  ): Promise<void> {
    return this.samples.remove(actor, id, body);
  }

  @Post('samples/:id/flags/:flagId/undo')
  @HttpCode(200)
  @ApiOperation({
    summary: 'Undo a redaction',
    description:
      `${ACCESS} Puts the original text back and reopens the flag. Not redacted, or the sample left out: 409. ` +
      'Once a version has started training on the sample the original text is gone: 409.',
  })
  @ApiOkResponse({ schema: zodSchemaObject(sampleDetailSchema) })
  undoRedaction(
    @CurrentActor() actor: Actor,
    @Param('id', ParseUUIDPipe) id: string,
    @Param('flagId', ParseUUIDPipe) flagId: string,
  ): Promise<SampleDetail> {
    return this.samples.undoFlagRedaction(actor, id, flagId);
  }
}
