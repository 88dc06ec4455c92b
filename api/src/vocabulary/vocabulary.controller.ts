import { Body, Controller, Get, Param, ParseUUIDPipe, Put, Query, StreamableFile } from '@nestjs/common';
import { ApiBody, ApiOkResponse, ApiOperation, ApiProduces, ApiQuery, ApiTags } from '@nestjs/swagger';
import {
  type ClientVocabularyState,
  clientVocabularyStateSchema,
  type MisspellingList,
  misspellingListSchema,
  updateClientVocabularySchema,
  type VocabularyPage,
  vocabularyPageSchema,
  type VocabularyQuery,
  vocabularyQuerySchema,
  vocabularyShows,
  vocabularySorts,
} from '@keyloom/shared';
import type { z } from 'zod';
import { CurrentActor } from '../auth/decorators/current-user.decorator';
import { Roles } from '../auth/decorators/roles.decorator';
import type { Actor } from '../auth/session-user';
import { zodSchemaObject } from '../common/openapi/zod-schema-object';
import { ZodValidationPipe } from '../common/pipes/zod-validation.pipe';
import { type VocabularyFile, VersionVocabularyService } from './version-vocabulary.service';
import { VocabularyService } from './vocabulary.service';

type UpdateClientVocabulary = z.output<typeof updateClientVocabularySchema>;

const READERS =
  'Owning clinician and supervisor; carers and admins 403; a client or version out of sight 404.';
const FILES =
  'What a device should offer: blocked words (and pairs holding one) left out, additions in (source ' +
  '"added"). UTF-8; the CSV files start with a byte order mark. Audited with the format and row count.';

/** The download of one export (no client name in the file name). */
function download(file: VocabularyFile): StreamableFile {
  const bytes = Buffer.from(file.body, 'utf8');
  return new StreamableFile(bytes, {
    type: file.type,
    length: bytes.length,
    disposition: `attachment; filename="${file.fileName}"`,
  });
}

@ApiTags('vocabulary')
@Controller()
export class VocabularyController {
  constructor(
    private readonly vocabulary: VocabularyService,
    private readonly versions: VersionVocabularyService,
  ) {}

  @Get('clients/:id/vocabulary')
  @Roles('clinician', 'supervisor')
  @ApiOperation({
    summary: 'The client’s current vocabulary list (what the next version freezes)',
    description: `${READERS} Nothing saved yet: revision 0 and empty lists.`,
  })
  @ApiOkResponse({ schema: zodSchemaObject(clientVocabularyStateSchema) })
  get(@CurrentActor() actor: Actor, @Param('id', ParseUUIDPipe) id: string): Promise<ClientVocabularyState> {
    return this.vocabulary.get(actor, id);
  }

  @Put('clients/:id/vocabulary')
  @Roles('clinician')
  @ApiOperation({
    summary: 'Save the client’s vocabulary list (additions, blocks, kept spellings)',
    description:
      'Owning clinician. `revision` must be the current one, else 409 and nothing changes (two tabs; ' +
      'a double submission saves once). Audited with counts only.',
  })
  @ApiBody({ schema: zodSchemaObject(updateClientVocabularySchema) })
  @ApiOkResponse({ schema: zodSchemaObject(clientVocabularyStateSchema) })
  update(
    @CurrentActor() actor: Actor,
    @Param('id', ParseUUIDPipe) id: string,
    @Body(new ZodValidationPipe(updateClientVocabularySchema)) body: UpdateClientVocabulary,
  ): Promise<ClientVocabularyState> {
    return this.vocabulary.update(actor, id, body);
  }

  @Get('profile-versions/:id/vocabulary')
  @Roles('clinician', 'supervisor')
  @ApiOperation({
    summary: 'The version’s vocabulary, a page at a time',
    description:
      `${READERS} From the version's frozen samples (oldest first) and its own additions and blocks. ` +
      '`query` matches keys starting with the lower-cased text first, then keys containing it.',
  })
  @ApiQuery({ name: 'query', required: false, schema: { type: 'string', maxLength: 60 } })
  @ApiQuery({ name: 'sort', required: false, schema: { type: 'string', enum: [...vocabularySorts] } })
  @ApiQuery({ name: 'order', required: false, schema: { type: 'string', enum: ['asc', 'desc'] } })
  @ApiQuery({ name: 'show', required: false, schema: { type: 'string', enum: [...vocabularyShows] } })
  @ApiQuery({ name: 'page', required: false, schema: { type: 'integer', minimum: 1, default: 1 } })
  @ApiQuery({
    name: 'pageSize',
    required: false,
    schema: { type: 'integer', minimum: 10, maximum: 200, default: 50 },
  })
  @ApiOkResponse({ schema: zodSchemaObject(vocabularyPageSchema) })
  page(
    @CurrentActor() actor: Actor,
    @Param('id', ParseUUIDPipe) id: string,
    @Query(new ZodValidationPipe(vocabularyQuerySchema)) query: VocabularyQuery,
  ): Promise<VocabularyPage> {
    return this.versions.page(actor, id, query);
  }

  @Get('profile-versions/:id/misspellings')
  @Roles('clinician', 'supervisor')
  @ApiOperation({
    summary: 'Words of the version that look like misspellings of a much commoner word',
    description: `${READERS} Leaves out the keys the client's current list blocks or keeps.`,
  })
  @ApiOkResponse({ schema: zodSchemaObject(misspellingListSchema) })
  misspellings(
    @CurrentActor() actor: Actor,
    @Param('id', ParseUUIDPipe) id: string,
  ): Promise<MisspellingList> {
    return this.versions.misspellings(actor, id);
  }

  @Get('profile-versions/:id/vocabulary.csv')
  @Roles('clinician', 'supervisor')
  @ApiOperation({
    summary: 'The version’s vocabulary as CSV: word,count,source',
    description: `${READERS} ${FILES}`,
  })
  @ApiProduces('text/csv')
  @ApiOkResponse({ schema: { type: 'string' } })
  async csv(@CurrentActor() actor: Actor, @Param('id', ParseUUIDPipe) id: string): Promise<StreamableFile> {
    return download(await this.versions.export(actor, id, 'csv'));
  }

  @Get('profile-versions/:id/vocabulary.txt')
  @Roles('clinician', 'supervisor')
  @ApiOperation({
    summary: 'The version’s vocabulary, one word per line',
    description: `${READERS} ${FILES}`,
  })
  @ApiProduces('text/plain')
  @ApiOkResponse({ schema: { type: 'string' } })
  async text(@CurrentActor() actor: Actor, @Param('id', ParseUUIDPipe) id: string): Promise<StreamableFile> {
    return download(await this.versions.export(actor, id, 'txt'));
  }

  @Get('profile-versions/:id/word-pairs.csv')
  @Roles('clinician', 'supervisor')
  @ApiOperation({
    summary: 'Word pairs of the version as CSV: previous,word,count',
    description: `${READERS} ${FILES}`,
  })
  @ApiProduces('text/csv')
  @ApiOkResponse({ schema: { type: 'string' } })
  async pairs(@CurrentActor() actor: Actor, @Param('id', ParseUUIDPipe) id: string): Promise<StreamableFile> {
    return download(await this.versions.export(actor, id, 'pairs'));
  }
}
