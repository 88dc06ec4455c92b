import {
  Body,
  Controller,
  Delete,
  Get,
  Header,
  HttpCode,
  Param,
  ParseUUIDPipe,
  Patch,
  Post,
  Res,
} from '@nestjs/common';
import {
  ApiBody,
  ApiCreatedResponse,
  ApiHeader,
  ApiNoContentResponse,
  ApiOkResponse,
  ApiOperation,
  ApiTags,
} from '@nestjs/swagger';
import {
  type CreateSummaryInput,
  createSummarySchema,
  type Summary,
  type SummaryMessagePreview,
  summaryMessagePreviewSchema,
  type SummaryPreview,
  type SummaryPreviewRequest,
  summaryPreviewRequestSchema,
  summaryPreviewSchema,
  summarySchema,
  type UpdateSummaryInput,
  updateSummarySchema,
} from '@keyloom/shared';
import type { Response } from 'express';
import { z } from 'zod';
import { CurrentActor } from '../auth/decorators/current-user.decorator';
import { Public } from '../auth/decorators/public.decorator';
import { SkipCsrf } from '../auth/decorators/skip-csrf.decorator';
import { Roles } from '../auth/decorators/roles.decorator';
import type { Actor } from '../auth/session-user';
import { zodSchemaObject } from '../common/openapi/zod-schema-object';
import { ZodValidationPipe } from '../common/pipes/zod-validation.pipe';
import { IDEMPOTENCY_KEY_HEADER, IdempotencyKeyHeader } from '../idempotency/idempotency-key';
import { isStopToken, stopFormPage, stoppedPage, unknownStopPage } from './stop-page';
import { StopPageContextService } from './stop-page-context';
import { SummariesService } from './summaries.service';

const IDEMPOTENCY_HEADER_DOC = {
  name: IDEMPOTENCY_KEY_HEADER,
  required: false,
  description: 'A fresh quoted string per send action (e.g. a UUID), the same when the action is retried.',
};

@ApiTags('summaries')
@Controller()
export class SummariesController {
  constructor(
    private readonly summaries: SummariesService,
    private readonly stopPages: StopPageContextService,
  ) {}

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
    summary: 'Compose a progress summary as a draft (status draft) with the generated text',
    description:
      'Owning clinician; a client consent covering summaries (409). Empty versionIds: every version ' +
      'approved in the period (active or retired since); other versions only when chosen. Staff comments ' +
      'are quoted only when listed in includeComments. A contact without consent, or who stopped ' +
      'summaries: 400. Nothing is e-mailed until POST /api/summaries/:id/send. With an Idempotency-Key, ' +
      'a repeat answers the first result (same key, other body: 422; first still running: 409).',
  })
  @ApiHeader(IDEMPOTENCY_HEADER_DOC)
  @ApiBody({ schema: zodSchemaObject(createSummarySchema) })
  @ApiCreatedResponse({ schema: zodSchemaObject(summarySchema) })
  create(
    @CurrentActor() actor: Actor,
    @Param('id', ParseUUIDPipe) id: string,
    @Body(new ZodValidationPipe(createSummarySchema)) body: CreateSummaryInput,
    @IdempotencyKeyHeader() key: string | undefined,
  ): Promise<Summary> {
    return this.summaries.create(actor, id, body, key);
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

  // Declared before summaries/:id so "stop" is never read as an id. Opening the link changes nothing
  // (mail scanners open links): the page's button POSTs to the same address. Both answer HTML for the
  // recipient's browser, also for an unknown token (404).
  @Get('summaries/stop/:token')
  @Public()
  @Header('Content-Type', 'text/html; charset=utf-8')
  @Header('Cache-Control', 'no-store')
  @ApiOperation({
    summary: 'Public stop link from the e-mail: a page with a "Stop these e-mails" button (HTML)',
    description:
      'Changes nothing. The button (and mail programs, RFC 8058) POST to the same path. 404 for unknown tokens.',
  })
  async stopPage(@Param('token') token: string, @Res({ passthrough: true }) res: Response): Promise<string> {
    const state = isStopToken(token) ? await this.summaries.stopState(token) : 'unknown';
    if (state === 'unknown') {
      res.status(404);
      return unknownStopPage(await this.stopPages.clinic());
    }
    const context = await this.stopPages.forToken(token);
    return state === 'stopped' ? stoppedPage(context) : stopFormPage(token, context);
  }

  @Post('summaries/stop/:token')
  @Public()
  @SkipCsrf()
  @HttpCode(200)
  @Header('Content-Type', 'text/html; charset=utf-8')
  @Header('Cache-Control', 'no-store')
  @ApiOperation({
    summary: 'Stop summaries to this recipient (the stop page’s button; RFC 8058 one-click)',
    description:
      'Public and without a CSRF token: the 256-bit token in the path is the only key (mail programs post ' +
      'with no session). The contact gets no more summaries; idempotent; 404 for unknown tokens.',
  })
  async stop(@Param('token') token: string, @Res({ passthrough: true }) res: Response): Promise<string> {
    const done = isStopToken(token) && (await this.summaries.stop(token));
    if (!done) {
      res.status(404);
      return unknownStopPage(await this.stopPages.clinic());
    }
    return stoppedPage(await this.stopPages.forToken(token));
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
    description:
      'Owning clinician. Nobody left, or an e-mail of the last round still queued: 409. With an ' +
      'Idempotency-Key, a repeat answers the first result and sends nothing.',
  })
  @ApiHeader(IDEMPOTENCY_HEADER_DOC)
  @ApiOkResponse({ schema: zodSchemaObject(summarySchema) })
  resend(
    @CurrentActor() actor: Actor,
    @Param('id', ParseUUIDPipe) id: string,
    @IdempotencyKeyHeader() key: string | undefined,
  ): Promise<Summary> {
    return this.summaries.resend(actor, id, key);
  }

  @Patch('summaries/:id')
  @Roles('clinician')
  @ApiOperation({
    summary: 'Edit a draft summary: subject, text, versions, ticked comments, recipients, note',
    description:
      'Owning clinician; drafts only (409 once sent). Changing versions, comments or note writes the ' +
      'generated text again, replacing the draft text only while it was not edited (or with regenerate).',
  })
  @ApiBody({ schema: zodSchemaObject(updateSummarySchema) })
  @ApiOkResponse({ schema: zodSchemaObject(summarySchema) })
  update(
    @CurrentActor() actor: Actor,
    @Param('id', ParseUUIDPipe) id: string,
    @Body(new ZodValidationPipe(updateSummarySchema)) body: UpdateSummaryInput,
  ): Promise<Summary> {
    return this.summaries.update(actor, id, body);
  }

  @Delete('summaries/:id')
  @Roles('clinician')
  @HttpCode(204)
  @ApiOperation({
    summary: 'Delete a draft summary (nothing was sent)',
    description: 'Owning clinician; drafts only (409 once sent).',
  })
  @ApiNoContentResponse()
  async remove(@CurrentActor() actor: Actor, @Param('id', ParseUUIDPipe) id: string): Promise<void> {
    await this.summaries.remove(actor, id);
  }

  @Post('summaries/:id/send')
  @Roles('clinician')
  @HttpCode(200)
  @ApiOperation({
    summary: 'Send a draft summary: its subject and text exactly as they stand',
    description:
      'Owning clinician; 409 unless a draft; each recipient checked again (consent, stop: 400). The ' +
      'e-mails go out from the worker. With an Idempotency-Key, a repeat answers the first result and ' +
      'sends nothing.',
  })
  @ApiHeader(IDEMPOTENCY_HEADER_DOC)
  @ApiOkResponse({ schema: zodSchemaObject(summarySchema) })
  send(
    @CurrentActor() actor: Actor,
    @Param('id', ParseUUIDPipe) id: string,
    @IdempotencyKeyHeader() key: string | undefined,
  ): Promise<Summary> {
    return this.summaries.send(actor, id, key);
  }

  @Get('summaries/:id/message')
  @ApiOperation({
    summary: 'The e-mail exactly as the family receives it: HTML and plain-text parts, headers, charts',
    description: 'Owning clinician, supervisor. The stop link in it is an example.',
  })
  @ApiOkResponse({ schema: zodSchemaObject(summaryMessagePreviewSchema) })
  message(
    @CurrentActor() actor: Actor,
    @Param('id', ParseUUIDPipe) id: string,
  ): Promise<SummaryMessagePreview> {
    return this.summaries.message(actor, id);
  }
}
