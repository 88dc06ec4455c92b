import { Body, Controller, Get, Param, ParseUUIDPipe, Post, Res } from '@nestjs/common';
import { ApiBody, ApiCreatedResponse, ApiOkResponse, ApiOperation, ApiTags } from '@nestjs/swagger';
import { type CreateTrialBody, createTrialSchema, type Trial, trialSchema } from '@keyloom/shared';
import type { Response } from 'express';
import { z } from 'zod';
import { CurrentActor } from '../auth/decorators/current-user.decorator';
import { Roles } from '../auth/decorators/roles.decorator';
import type { Actor } from '../auth/session-user';
import { zodSchemaObject } from '../common/openapi/zod-schema-object';
import { ZodValidationPipe } from '../common/pipes/zod-validation.pipe';
import { TrialsService } from './trials.service';

@ApiTags('test keyboard')
@Controller()
export class TrialsController {
  constructor(private readonly trials: TrialsService) {}

  @Get('profile-versions/:id/trials')
  @ApiOperation({
    summary: 'The version’s trials on the test keyboard, newest first (without their logs)',
    description: 'Owning clinician, assigned carer, supervisor. Admin: 403; a client out of sight: 404.',
  })
  @ApiOkResponse({ schema: zodSchemaObject(z.array(trialSchema)) })
  list(@CurrentActor() actor: Actor, @Param('id', ParseUUIDPipe) id: string): Promise<Trial[]> {
    return this.trials.list(actor, id);
  }

  @Post('profile-versions/:id/trials')
  @Roles('clinician', 'carer')
  @ApiOperation({
    summary: 'Store a finished trial (the API replays the log and measures it)',
    description:
      'Owning clinician or assigned carer. A log that cannot be replayed, or whose text differs from `text`: ' +
      '400 naming the step. The version must be ready for trial, signed off or active (else 409). The same ' +
      'localTrialId again: 200 with the stored trial; on another version: 409.',
  })
  @ApiBody({ schema: zodSchemaObject(createTrialSchema) })
  @ApiCreatedResponse({ schema: zodSchemaObject(trialSchema) })
  async create(
    @CurrentActor() actor: Actor,
    @Param('id', ParseUUIDPipe) id: string,
    @Body(new ZodValidationPipe(createTrialSchema)) body: CreateTrialBody,
    @Res({ passthrough: true }) res: Response,
  ): Promise<Trial> {
    const upload = await this.trials.create(actor, id, body);
    res.status(upload.created ? 201 : 200);
    return upload.trial;
  }
}
