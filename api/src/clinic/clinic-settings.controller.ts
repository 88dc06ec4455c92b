import { Body, Controller, Get, Put } from '@nestjs/common';
import { ApiBody, ApiOkResponse, ApiOperation, ApiTags } from '@nestjs/swagger';
import {
  type ClinicSettings,
  type ClinicSettingsChanges,
  clinicSettingsSchema,
  updateClinicSettingsSchema,
} from '@keyloom/shared';
import { CurrentActor } from '../auth/decorators/current-user.decorator';
import { Roles } from '../auth/decorators/roles.decorator';
import type { Actor } from '../auth/session-user';
import { zodSchemaObject } from '../common/openapi/zod-schema-object';
import { ZodValidationPipe } from '../common/pipes/zod-validation.pipe';
import { ClinicSettingsService } from './clinic-settings.service';

@ApiTags('clinic')
@Controller('clinic-settings')
export class ClinicSettingsController {
  constructor(private readonly settings: ClinicSettingsService) {}

  @Get()
  @ApiOperation({
    summary: 'The clinic’s name, phone, address, e-mail and website (any signed-in staff)',
    description: 'Before an admin has saved them: configured false, name "the clinic", the rest empty.',
  })
  @ApiOkResponse({ schema: zodSchemaObject(clinicSettingsSchema) })
  get(): Promise<ClinicSettings> {
    return this.settings.get();
  }

  @Put()
  @Roles('admin')
  @ApiOperation({
    summary: 'Set the clinic’s details (admin)',
    description: 'Every field at once; empty e-mail and website are stored as none. Audited field by field.',
  })
  @ApiBody({ schema: zodSchemaObject(updateClinicSettingsSchema) })
  @ApiOkResponse({ schema: zodSchemaObject(clinicSettingsSchema) })
  update(
    @CurrentActor() actor: Actor,
    @Body(new ZodValidationPipe(updateClinicSettingsSchema)) body: ClinicSettingsChanges,
  ): Promise<ClinicSettings> {
    return this.settings.update(actor, body);
  }
}
