import {
  BadRequestException,
  Body,
  Controller,
  Get,
  HttpCode,
  Param,
  ParseUUIDPipe,
  Post,
  Put,
  StreamableFile,
  UploadedFile,
  UseGuards,
  UseInterceptors,
} from '@nestjs/common';
import { FileInterceptor } from '@nestjs/platform-express';
import {
  ApiBody,
  ApiConsumes,
  ApiCreatedResponse,
  ApiOkResponse,
  ApiOperation,
  ApiProduces,
  ApiTags,
} from '@nestjs/swagger';
import {
  consentSchema,
  type CreateConsentInput,
  createConsentSchema,
  type VoidConsentInput,
  voidConsentSchema,
  type WithdrawConsentInput,
  type WithdrawalPreview,
  withdrawalPreviewSchema,
  withdrawConsentSchema,
} from '@keyloom/shared';
import { memoryStorage } from 'multer';
import { z } from 'zod';
import { CurrentActor } from '../auth/decorators/current-user.decorator';
import type { Actor } from '../auth/session-user';
import { Roles } from '../auth/decorators/roles.decorator';
import { OwnedClientGuard } from '../clients/owned-client.guard';
import { zodSchemaObject } from '../common/openapi/zod-schema-object';
import { ZodValidationPipe } from '../common/pipes/zod-validation.pipe';
import {
  ConsentDocumentErrors,
  DOCUMENT_FIELD_MESSAGE,
  MAX_CONSENT_DOCUMENT_BYTES,
} from './consent-document.interceptor';
import { ConsentsService } from './consents.service';
import type { ConsentDto } from './dto/consent.dto';

@ApiTags('consents')
@Controller('clients/:id/consents')
export class ConsentsController {
  constructor(private readonly consents: ConsentsService) {}

  @Get()
  @ApiOperation({ summary: 'Consent records of a client, newest first (owning clinician, supervisor)' })
  @ApiOkResponse({ schema: zodSchemaObject(z.array(consentSchema)) })
  findAll(@CurrentActor() actor: Actor, @Param('id', ParseUUIDPipe) id: string): Promise<ConsentDto[]> {
    return this.consents.findAll(actor, id);
  }

  @Post()
  @Roles('clinician')
  @ApiOperation({ summary: 'Record a consent (owning clinician); givenOn may not be after today' })
  @ApiBody({ schema: zodSchemaObject(createConsentSchema) })
  @ApiCreatedResponse({ schema: zodSchemaObject(consentSchema) })
  create(
    @CurrentActor() actor: Actor,
    @Param('id', ParseUUIDPipe) id: string,
    @Body(new ZodValidationPipe(createConsentSchema)) body: CreateConsentInput,
  ): Promise<ConsentDto> {
    return this.consents.create(actor, id, body);
  }

  @Get(':consentId/withdrawal-preview')
  @Roles('clinician')
  @ApiOperation({
    summary: 'What withdrawing or voiding this consent would delete now (owning clinician); changes nothing',
    description:
      'The counts the withdrawal would report, and for each scope the other consents in force that ' +
      'still cover it (their data is kept). Voiding deletes the same. A withdrawn or voided consent: 409.',
  })
  @ApiOkResponse({ schema: zodSchemaObject(withdrawalPreviewSchema) })
  withdrawalPreview(
    @CurrentActor() actor: Actor,
    @Param('id', ParseUUIDPipe) id: string,
    @Param('consentId', ParseUUIDPipe) consentId: string,
  ): Promise<WithdrawalPreview> {
    return this.consents.withdrawalPreview(actor, id, consentId);
  }

  @Post(':consentId/withdraw')
  @Roles('clinician')
  @HttpCode(200)
  @ApiOperation({
    summary: 'Withdraw a consent (owning clinician) — cannot be undone',
    description:
      'Deletes, in one transaction, what only this consent allowed: the language samples and everything ' +
      'derived from them when no other consent in force covers training; queued summary e-mails are ' +
      'cancelled when none covers summaries. Answers 200 with the consent and its withdrawal report ' +
      '(every kind of row counted). A second withdrawal: 409.',
  })
  @ApiBody({ schema: zodSchemaObject(withdrawConsentSchema) })
  @ApiOkResponse({ schema: zodSchemaObject(consentSchema) })
  withdraw(
    @CurrentActor() actor: Actor,
    @Param('id', ParseUUIDPipe) id: string,
    @Param('consentId', ParseUUIDPipe) consentId: string,
    @Body(new ZodValidationPipe(withdrawConsentSchema)) body: WithdrawConsentInput,
  ): Promise<ConsentDto> {
    return this.consents.withdraw(actor, id, consentId, body);
  }

  @Post(':consentId/void')
  @Roles('clinician')
  @HttpCode(200)
  @ApiOperation({
    summary: 'Void a consent record made in error (owning clinician) — kept, struck through',
    description:
      'The record stays, with when, who and the reason, but no longer counts as consent. What only it ' +
      'allowed is deleted exactly as by a withdrawal (nothing while another consent in force covers ' +
      'the scope; GET …/withdrawal-preview gives the counts first). A voided or withdrawn record: 409.',
  })
  @ApiBody({ schema: zodSchemaObject(voidConsentSchema) })
  @ApiOkResponse({ schema: zodSchemaObject(consentSchema) })
  voidConsent(
    @CurrentActor() actor: Actor,
    @Param('id', ParseUUIDPipe) id: string,
    @Param('consentId', ParseUUIDPipe) consentId: string,
    @Body(new ZodValidationPipe(voidConsentSchema)) body: VoidConsentInput,
  ): Promise<ConsentDto> {
    return this.consents.voidConsent(actor, id, consentId, body);
  }

  @Put(':consentId/document')
  @Roles('clinician')
  // The caseload is checked before multer reads the file (guards run before interceptors).
  @UseGuards(OwnedClientGuard)
  @UseInterceptors(
    ConsentDocumentErrors,
    FileInterceptor('file', {
      storage: memoryStorage(),
      limits: { fileSize: MAX_CONSENT_DOCUMENT_BYTES, files: 1, fields: 10 },
    }),
  )
  @ApiOperation({
    summary: 'Attach the scanned consent form (owning clinician)',
    description:
      'Multipart field "file": PDF, PNG or JPEG, recognised by its first bytes, at most 10 MB (413 above). ' +
      'Replaces an earlier form; a withdrawn consent cannot be changed (409).',
  })
  @ApiConsumes('multipart/form-data')
  @ApiBody({
    schema: {
      type: 'object',
      required: ['file'],
      properties: { file: { type: 'string', format: 'binary' } },
    },
  })
  @ApiOkResponse({ schema: zodSchemaObject(consentSchema) })
  attachDocument(
    @CurrentActor() actor: Actor,
    @Param('id', ParseUUIDPipe) id: string,
    @Param('consentId', ParseUUIDPipe) consentId: string,
    @UploadedFile() file: Express.Multer.File | undefined,
  ): Promise<ConsentDto> {
    if (!file) throw new BadRequestException(DOCUMENT_FIELD_MESSAGE);
    return this.consents.attachDocument(actor, id, consentId, file);
  }

  @Get(':consentId/document')
  @ApiOperation({ summary: 'Download the consent form (owning clinician, supervisor; carers 403)' })
  @ApiProduces('application/pdf', 'image/png', 'image/jpeg')
  @ApiOkResponse({ schema: { type: 'string', format: 'binary' } })
  async document(
    @CurrentActor() actor: Actor,
    @Param('id', ParseUUIDPipe) id: string,
    @Param('consentId', ParseUUIDPipe) consentId: string,
  ): Promise<StreamableFile> {
    const stored = await this.consents.document(actor, id, consentId);
    const ascii = stored.fileName.replace(/[^\x20-\x7e]/g, '_');
    return new StreamableFile(stored.bytes, {
      type: stored.mimeType,
      length: stored.bytes.length,
      disposition: `attachment; filename="${ascii}"; filename*=UTF-8''${encodeURIComponent(stored.fileName)}`,
    });
  }
}
