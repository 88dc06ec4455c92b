import { Body, Controller, Delete, Get, HttpCode, Param, ParseUUIDPipe, Post } from '@nestjs/common';
import { ApiBody, ApiCreatedResponse, ApiOkResponse, ApiOperation, ApiTags } from '@nestjs/swagger';
import {
  type CreatePracticePhraseInput,
  createPracticePhraseSchema,
  type PracticePhrase,
  practicePhraseSchema,
} from '@keyloom/shared';
import { z } from 'zod';
import { CurrentActor } from '../auth/decorators/current-user.decorator';
import { Roles } from '../auth/decorators/roles.decorator';
import type { Actor } from '../auth/session-user';
import { zodSchemaObject } from '../common/openapi/zod-schema-object';
import { ZodValidationPipe } from '../common/pipes/zod-validation.pipe';
import { PracticePhrasesService } from './practice-phrases.service';

@ApiTags('test keyboard')
@Controller('clients/:id/practice-phrases')
export class PracticePhrasesController {
  constructor(private readonly phrases: PracticePhrasesService) {}

  @Get()
  @ApiOperation({
    summary: 'Practice phrases: Keyloom’s own, then the client’s own (oldest first)',
    description: 'Owning clinician, assigned carer, supervisor. Admin: 403; a client out of sight: 404.',
  })
  @ApiOkResponse({ schema: zodSchemaObject(z.array(practicePhraseSchema)) })
  list(@CurrentActor() actor: Actor, @Param('id', ParseUUIDPipe) id: string): Promise<PracticePhrase[]> {
    return this.phrases.list(actor, id);
  }

  @Post()
  @Roles('clinician')
  @ApiOperation({
    summary: 'Add a practice phrase of the client’s own',
    description:
      'Owning clinician. The same text (ignoring case) already listed, or 200 of the client’s own: 409.',
  })
  @ApiBody({ schema: zodSchemaObject(createPracticePhraseSchema) })
  @ApiCreatedResponse({ schema: zodSchemaObject(practicePhraseSchema) })
  create(
    @CurrentActor() actor: Actor,
    @Param('id', ParseUUIDPipe) id: string,
    @Body(new ZodValidationPipe(createPracticePhraseSchema)) body: CreatePracticePhraseInput,
  ): Promise<PracticePhrase> {
    return this.phrases.create(actor, id, body);
  }

  @Delete(':phraseId')
  @Roles('clinician')
  @HttpCode(204)
  @ApiOperation({
    summary: 'Remove one of the client’s own practice phrases',
    description: 'Owning clinician. Keyloom’s own phrases: 409; unknown id: 404.',
  })
  remove(
    @CurrentActor() actor: Actor,
    @Param('id', ParseUUIDPipe) id: string,
    @Param('phraseId') phraseId: string,
  ): Promise<void> {
    return this.phrases.remove(actor, id, phraseId);
  }
}
