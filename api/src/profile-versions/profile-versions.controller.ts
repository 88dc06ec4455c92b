import {
  BadRequestException,
  Body,
  Controller,
  Delete,
  Get,
  HttpCode,
  Param,
  ParseUUIDPipe,
  Patch,
  Post,
  StreamableFile,
  UploadedFile,
  UseInterceptors,
} from '@nestjs/common';
import { FileInterceptor } from '@nestjs/platform-express';
import {
  ApiBody,
  ApiConsumes,
  ApiCreatedResponse,
  ApiNoContentResponse,
  ApiOkResponse,
  ApiOperation,
  ApiProduces,
  ApiTags,
} from '@nestjs/swagger';
import {
  type ApproveInput,
  approveSchema,
  type CreateProfileVersionInput,
  createProfileVersionSchema,
  profileFileCheckSchema,
  profileVersionSchema,
  type ReportProblemInput,
  reportProblemSchema,
  type RetireInput,
  retireSchema,
  type SendBackInput,
  sendBackSchema,
  type SignOffInput,
  signOffSchema,
  type UpdateProfileVersionInput,
  updateProfileVersionSchema,
} from '@keyloom/shared';
import { memoryStorage } from 'multer';
import { z } from 'zod';
import { CurrentActor } from '../auth/decorators/current-user.decorator';
import type { Actor } from '../auth/session-user';
import { Roles } from '../auth/decorators/roles.decorator';
import { zodSchemaObject } from '../common/openapi/zod-schema-object';
import { ZodValidationPipe } from '../common/pipes/zod-validation.pipe';
import type { ProfileVersionDto } from './profile-version.mapper';
import { type ProfileFileReport, ProfileVersionsService } from './profile-versions.service';

/** Largest .klprofile accepted for checking (a 200,000-character profile's model is a few MB). */
export const MAX_PROFILE_FILE_BYTES = 64 * 1024 * 1024;
export const PROFILE_FILE_FIELD_MESSAGE = 'Send one .klprofile file in the multipart field "file".';

const TRANSITION =
  'Wrong status: 409 with a message ("This version is already signed off." …). Unknown id, or a client ' +
  'out of sight: 404.';

@ApiTags('profile versions')
@Controller()
export class ProfileVersionsController {
  constructor(private readonly versions: ProfileVersionsService) {}

  @Get('clients/:id/profile-versions')
  @ApiOperation({
    summary: 'The client’s profile versions, newest first',
    description: 'Owning clinician, supervisor, assigned carer. Admin: 403.',
  })
  @ApiOkResponse({ schema: zodSchemaObject(z.array(profileVersionSchema)) })
  list(@CurrentActor() actor: Actor, @Param('id', ParseUUIDPipe) id: string): Promise<ProfileVersionDto[]> {
    return this.versions.list(actor, id);
  }

  @Post('clients/:id/profile-versions')
  @Roles('clinician')
  @ApiOperation({
    summary: 'Configure a new version (draft): settings and samples are frozen',
    description:
      'Owning clinician; active training consent (409); under 500 characters of writing in the chosen ' +
      'samples: 400 with both figures. access defaults to the client record; sampleIds ' +
      'to every ready sample (a chosen sample that is excluded or still flagged: 400); settings.vocabulary ' +
      'to the client’s current vocabulary list (GET /api/clients/:id/vocabulary).',
  })
  @ApiBody({ schema: zodSchemaObject(createProfileVersionSchema) })
  @ApiCreatedResponse({ schema: zodSchemaObject(profileVersionSchema) })
  create(
    @CurrentActor() actor: Actor,
    @Param('id', ParseUUIDPipe) id: string,
    @Body(new ZodValidationPipe(createProfileVersionSchema)) body: CreateProfileVersionInput,
  ): Promise<ProfileVersionDto> {
    return this.versions.create(actor, id, body);
  }

  @Get('profile-versions/:id')
  @ApiOperation({ summary: 'One version: status, progress (0–1), stage, metrics, history' })
  @ApiOkResponse({ schema: zodSchemaObject(profileVersionSchema) })
  findOne(@CurrentActor() actor: Actor, @Param('id', ParseUUIDPipe) id: string): Promise<ProfileVersionDto> {
    return this.versions.findOne(actor, id);
  }

  @Patch('profile-versions/:id')
  @Roles('clinician')
  @ApiOperation({
    summary: 'Edit a draft: the fields the create takes; each one sent replaces the draft’s',
    description:
      'Owning clinician; active training consent (409). Settings and samples are frozen again as at ' +
      'creation; under 500 characters of writing: 400 with both figures. Not a draft: 409. Unknown id, or ' +
      'a client out of sight: 404.',
  })
  @ApiBody({ schema: zodSchemaObject(updateProfileVersionSchema) })
  @ApiOkResponse({ schema: zodSchemaObject(profileVersionSchema) })
  update(
    @CurrentActor() actor: Actor,
    @Param('id', ParseUUIDPipe) id: string,
    @Body(new ZodValidationPipe(updateProfileVersionSchema)) body: UpdateProfileVersionInput,
  ): Promise<ProfileVersionDto> {
    return this.versions.update(actor, id, body);
  }

  @Delete('profile-versions/:id')
  @HttpCode(204)
  @Roles('clinician')
  @ApiOperation({
    summary: 'Delete a draft',
    description: 'Owning clinician. Not a draft: 409 (trained versions are kept). Unknown id: 404.',
  })
  @ApiNoContentResponse({ description: 'Deleted.' })
  remove(@CurrentActor() actor: Actor, @Param('id', ParseUUIDPipe) id: string): Promise<void> {
    return this.versions.remove(actor, id);
  }

  @Post('profile-versions/:id/train')
  @HttpCode(200)
  @Roles('clinician')
  @ApiOperation({
    summary: 'Queue training and evaluation (draft or failed → training)',
    description:
      'Owning clinician; active training consent (409); under 500 characters or bad settings: 400 with the ' +
      `engine's message. Also from training when its job is dead (worker killed). ${TRANSITION}`,
  })
  @ApiOkResponse({ schema: zodSchemaObject(profileVersionSchema) })
  train(@CurrentActor() actor: Actor, @Param('id', ParseUUIDPipe) id: string): Promise<ProfileVersionDto> {
    return this.versions.train(actor, id);
  }

  @Post('profile-versions/:id/cancel')
  @HttpCode(200)
  @Roles('clinician')
  @ApiOperation({
    summary: 'Cancel training (training → draft)',
    description: `Owning clinician. ${TRANSITION}`,
  })
  @ApiOkResponse({ schema: zodSchemaObject(profileVersionSchema) })
  cancel(@CurrentActor() actor: Actor, @Param('id', ParseUUIDPipe) id: string): Promise<ProfileVersionDto> {
    return this.versions.cancel(actor, id);
  }

  @Post('profile-versions/:id/sign-off')
  @HttpCode(200)
  @Roles('carer')
  @ApiOperation({
    summary: 'Sign off after a trial (trained → signed_off)',
    description: `Assigned carer; the version needs at least one trial on the test keyboard (else 409). ${TRANSITION}`,
  })
  @ApiBody({ schema: zodSchemaObject(signOffSchema) })
  @ApiOkResponse({ schema: zodSchemaObject(profileVersionSchema) })
  signOff(
    @CurrentActor() actor: Actor,
    @Param('id', ParseUUIDPipe) id: string,
    @Body(new ZodValidationPipe(signOffSchema)) body: SignOffInput,
  ): Promise<ProfileVersionDto> {
    return this.versions.signOff(actor, id, body);
  }

  @Post('profile-versions/:id/report-problem')
  @HttpCode(200)
  @Roles('carer')
  @ApiOperation({
    summary: 'Report a problem after a trial instead of signing off (trained → sent_back)',
    description: `Assigned carer; the version needs at least one trial (else 409). ${TRANSITION}`,
  })
  @ApiBody({ schema: zodSchemaObject(reportProblemSchema) })
  @ApiOkResponse({ schema: zodSchemaObject(profileVersionSchema) })
  reportProblem(
    @CurrentActor() actor: Actor,
    @Param('id', ParseUUIDPipe) id: string,
    @Body(new ZodValidationPipe(reportProblemSchema)) body: ReportProblemInput,
  ): Promise<ProfileVersionDto> {
    return this.versions.reportProblem(actor, id, body);
  }

  @Post('profile-versions/:id/approve')
  @HttpCode(200)
  @Roles('supervisor')
  @ApiOperation({
    summary: 'Approve (signed_off → active; the previous active version → retired)',
    description: `Supervisor who neither created nor signed off the version (else 403). ${TRANSITION}`,
  })
  @ApiBody({ schema: zodSchemaObject(approveSchema) })
  @ApiOkResponse({ schema: zodSchemaObject(profileVersionSchema) })
  approve(
    @CurrentActor() actor: Actor,
    @Param('id', ParseUUIDPipe) id: string,
    @Body(new ZodValidationPipe(approveSchema)) body: ApproveInput,
  ): Promise<ProfileVersionDto> {
    return this.versions.approve(actor, id, body);
  }

  @Post('profile-versions/:id/retire')
  @HttpCode(200)
  @Roles('supervisor')
  @ApiOperation({
    summary: 'Retire the active version (active → retired; the previous approved version → active, or none)',
    description:
      'Supervisor, with a reason. The previous version is the most recently approved one before it that ' +
      `was not itself retired by hand. Not the active version: 409. ${TRANSITION}`,
  })
  @ApiBody({ schema: zodSchemaObject(retireSchema) })
  @ApiOkResponse({ schema: zodSchemaObject(profileVersionSchema) })
  retire(
    @CurrentActor() actor: Actor,
    @Param('id', ParseUUIDPipe) id: string,
    @Body(new ZodValidationPipe(retireSchema)) body: RetireInput,
  ): Promise<ProfileVersionDto> {
    return this.versions.retire(actor, id, body);
  }

  @Post('profile-versions/:id/send-back')
  @HttpCode(200)
  @Roles('supervisor')
  @ApiOperation({
    summary: 'Send back with a reason (signed_off → sent_back)',
    description: `Supervisor. ${TRANSITION}`,
  })
  @ApiBody({ schema: zodSchemaObject(sendBackSchema) })
  @ApiOkResponse({ schema: zodSchemaObject(profileVersionSchema) })
  sendBack(
    @CurrentActor() actor: Actor,
    @Param('id', ParseUUIDPipe) id: string,
    @Body(new ZodValidationPipe(sendBackSchema)) body: SendBackInput,
  ): Promise<ProfileVersionDto> {
    return this.versions.sendBack(actor, id, body);
  }

  @Get('profile-versions/:id/export')
  @Roles('clinician', 'supervisor')
  @ApiOperation({
    summary: 'Download the version as a .klprofile file (trained or later)',
    description: 'Owning clinician or supervisor; carers 403; no model yet: 409.',
  })
  @ApiProduces('application/octet-stream')
  @ApiOkResponse({ schema: { type: 'string', format: 'binary' } })
  async export(
    @CurrentActor() actor: Actor,
    @Param('id', ParseUUIDPipe) id: string,
  ): Promise<StreamableFile> {
    const file = await this.versions.export(actor, id);
    return new StreamableFile(file.bytes, {
      type: 'application/octet-stream',
      length: file.bytes.length,
      disposition: `attachment; filename="${file.fileName}"`,
    });
  }

  @Post('profile-exports/verify')
  @HttpCode(200)
  @Roles('clinician', 'supervisor')
  @UseInterceptors(
    FileInterceptor('file', {
      storage: memoryStorage(),
      limits: { fileSize: MAX_PROFILE_FILE_BYTES, files: 1, fields: 10 },
    }),
  )
  @ApiOperation({
    summary: 'Check a .klprofile file and report its contents',
    description:
      'Multipart field "file". Checks the magic, layout version, lengths, CRC-32 and that the model loads; ' +
      '400 with what is wrong (not a profile file, cut short, damaged). Apart from that, `authenticity` says ' +
      'whether this clinic signed it (HMAC-SHA-256 under its export key) and it is unchanged since; ' +
      '`valid` is both.',
  })
  @ApiConsumes('multipart/form-data')
  @ApiBody({
    schema: {
      type: 'object',
      required: ['file'],
      properties: { file: { type: 'string', format: 'binary' } },
    },
  })
  @ApiOkResponse({ schema: zodSchemaObject(profileFileCheckSchema) })
  verify(@UploadedFile() file: Express.Multer.File | undefined): Promise<ProfileFileReport> {
    if (!file) throw new BadRequestException(PROFILE_FILE_FIELD_MESSAGE);
    return this.versions.verify(file.originalname ?? null, file.buffer);
  }
}
