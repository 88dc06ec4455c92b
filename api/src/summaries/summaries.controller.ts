import {
  Body,
  Controller,
  Get,
  Header,
  HttpCode,
  NotFoundException,
  Param,
  ParseUUIDPipe,
  Post,
} from '@nestjs/common';
import { ApiBody, ApiCreatedResponse, ApiOkResponse, ApiOperation, ApiTags } from '@nestjs/swagger';
import {
  type CreateSummaryInput,
  createSummarySchema,
  type Summary,
  type SummaryPreview,
  type SummaryPreviewRequest,
  summaryPreviewRequestSchema,
  summaryPreviewSchema,
  summarySchema,
} from '@keyloom/shared';
import { z } from 'zod';
import { CurrentActor } from '../auth/decorators/current-user.decorator';
import { Public } from '../auth/decorators/public.decorator';
import { Roles } from '../auth/decorators/roles.decorator';
import type { Actor } from '../auth/session-user';
import { zodSchemaObject } from '../common/openapi/zod-schema-object';
import { ZodValidationPipe } from '../common/pipes/zod-validation.pipe';
import { SummariesService } from './summaries.service';

export const STOP_LINK_UNKNOWN_MESSAGE = 'This stop link is not known. It may have been copied incompletely.';

// A tiny page for the recipient's browser (no account, no client app): plain HTML, no scripts.
const stopPage = (heading: string, text: string): string =>
  `<!doctype html><html lang="en"><head><meta charset="utf-8"><title>${heading}</title>` +
  `<meta name="viewport" content="width=device-width, initial-scale=1"></head>` +
  `<body><main><h1>${heading}</h1><p>${text}</p></main></body></html>`;

@ApiTags('summaries')
@Controller()
export class SummariesController {
  constructor(private readonly summaries: SummariesService) {}

  @Get('clients/:id/summaries')
  @ApiOperation({
    summary: 'The client’s progress summaries, newest first',
    description: 'Owning clinician, supervisor.',
  })
  @ApiOkResponse({ schema: zodSchemaObject(z.array(summarySchema)) })
  list(@CurrentActor() actor: Actor, @Param('id', ParseUUIDPipe) id: string): Promise<Summary[]> {
    return this.summaries.list(actor, id);
  }

  @Post('clients/:id/summaries')
  @Roles('clinician')
  @ApiOperation({
    summary: 'Compose, store and queue a progress summary',
    description:
      'Owning clinician; a client consent covering summaries (409). Empty versionIds: every version ' +
      'trained or approved in the period. A contact without consent, or who stopped summaries: 400. ' +
      'Answers at once; the e-mails go out from the worker.',
  })
  @ApiBody({ schema: zodSchemaObject(createSummarySchema) })
  @ApiCreatedResponse({ schema: zodSchemaObject(summarySchema) })
  create(
    @CurrentActor() actor: Actor,
    @Param('id', ParseUUIDPipe) id: string,
    @Body(new ZodValidationPipe(createSummarySchema)) body: CreateSummaryInput,
  ): Promise<Summary> {
    return this.summaries.create(actor, id, body);
  }

  @Post('clients/:id/summaries/preview')
  @Roles('clinician')
  @HttpCode(200)
  @ApiOperation({
    summary: 'What a summary for this period would say and show (nothing stored or sent)',
    description: 'Owning clinician. Same body as sending, without contactIds.',
  })
  @ApiBody({ schema: zodSchemaObject(summaryPreviewRequestSchema) })
  @ApiOkResponse({ schema: zodSchemaObject(summaryPreviewSchema) })
  preview(
    @CurrentActor() actor: Actor,
    @Param('id', ParseUUIDPipe) id: string,
    @Body(new ZodValidationPipe(summaryPreviewRequestSchema)) body: SummaryPreviewRequest,
  ): Promise<SummaryPreview> {
    return this.summaries.preview(actor, id, body);
  }

  // Declared before summaries/:id so "stop" is never read as an id.
  @Get('summaries/stop/:token')
  @Public()
  @Header('Content-Type', 'text/html; charset=utf-8')
  @Header('Cache-Control', 'no-store')
  @ApiOperation({
    summary: 'Public stop link from the e-mail: no more summaries to this contact (HTML page)',
  })
  async stop(@Param('token') token: string): Promise<string> {
    if (!/^[A-Za-z0-9_-]{43}$/.test(token) || !(await this.summaries.stop(token))) {
      throw new NotFoundException(STOP_LINK_UNKNOWN_MESSAGE);
    }
    return stopPage(
      'Summaries stopped',
      'You will not receive further progress summaries. If this was a mistake, please tell the clinic.',
    );
  }

  @Get('summaries/:id')
  @ApiOperation({
    summary: 'One summary and the state of each e-mail',
    description: 'Owning clinician, supervisor.',
  })
  @ApiOkResponse({ schema: zodSchemaObject(summarySchema) })
  get(@CurrentActor() actor: Actor, @Param('id', ParseUUIDPipe) id: string): Promise<Summary> {
    return this.summaries.get(actor, id);
  }

  @Post('summaries/:id/resend')
  @Roles('clinician')
  @HttpCode(200)
  @ApiOperation({
    summary: 'Send the same summary again (a new round) to the original contacts who may still receive it',
    description: 'Owning clinician. Nobody left: 409.',
  })
  @ApiOkResponse({ schema: zodSchemaObject(summarySchema) })
  resend(@CurrentActor() actor: Actor, @Param('id', ParseUUIDPipe) id: string): Promise<Summary> {
    return this.summaries.resend(actor, id);
  }
}
