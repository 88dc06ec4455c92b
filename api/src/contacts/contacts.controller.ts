import { Body, Controller, Delete, Get, HttpCode, Param, ParseUUIDPipe, Patch, Post } from '@nestjs/common';
import {
  ApiBody,
  ApiCreatedResponse,
  ApiNoContentResponse,
  ApiOkResponse,
  ApiOperation,
  ApiTags,
} from '@nestjs/swagger';
import {
  contactSchema,
  type CreateContactInput,
  createContactSchema,
  type RenewSummariesConsentInput,
  renewSummariesConsentSchema,
  type UpdateContactInput,
  updateContactSchema,
} from '@keyloom/shared';
import { z } from 'zod';
import { CurrentActor } from '../auth/decorators/current-user.decorator';
import type { Actor } from '../auth/session-user';
import { Roles } from '../auth/decorators/roles.decorator';
import { zodSchemaObject } from '../common/openapi/zod-schema-object';
import { ZodValidationPipe } from '../common/pipes/zod-validation.pipe';
import { ContactsService } from './contacts.service';
import type { ContactDto } from './dto/contact.dto';

@ApiTags('contacts')
@Controller('clients/:id/contacts')
export class ContactsController {
  constructor(private readonly contacts: ContactsService) {}

  @Get()
  @ApiOperation({ summary: 'Family contacts of a client (owning clinician, supervisor)' })
  @ApiOkResponse({ schema: zodSchemaObject(z.array(contactSchema)) })
  findAll(@CurrentActor() actor: Actor, @Param('id', ParseUUIDPipe) id: string): Promise<ContactDto[]> {
    return this.contacts.findAll(actor, id);
  }

  @Post()
  @Roles('clinician')
  @ApiOperation({
    summary: 'Add a family contact (owning clinician)',
    description:
      'One contact per address per client, case-insensitive (409). An address that used the stop link ' +
      'comes in stopped and cannot be ticked as agreeing (409).',
  })
  @ApiBody({ schema: zodSchemaObject(createContactSchema) })
  @ApiCreatedResponse({ schema: zodSchemaObject(contactSchema) })
  create(
    @CurrentActor() actor: Actor,
    @Param('id', ParseUUIDPipe) id: string,
    @Body(new ZodValidationPipe(createContactSchema)) body: CreateContactInput,
  ): Promise<ContactDto> {
    return this.contacts.create(actor, id, body);
  }

  @Patch(':contactId')
  @Roles('clinician')
  @ApiOperation({
    summary: 'Change a family contact (owning clinician)',
    description:
      'A new address may not be another contact’s (409). A stopped address cannot be ticked as ' +
      'agreeing (409): only the family’s new consent (POST …/summaries-consent) lifts the stop.',
  })
  @ApiBody({ schema: zodSchemaObject(updateContactSchema) })
  @ApiOkResponse({ schema: zodSchemaObject(contactSchema) })
  update(
    @CurrentActor() actor: Actor,
    @Param('id', ParseUUIDPipe) id: string,
    @Param('contactId', ParseUUIDPipe) contactId: string,
    @Body(new ZodValidationPipe(updateContactSchema)) body: UpdateContactInput,
  ): Promise<ContactDto> {
    return this.contacts.update(actor, id, contactId, body);
  }

  @Delete(':contactId')
  @Roles('clinician')
  @HttpCode(204)
  @ApiOperation({
    summary: 'Delete a family contact (owning clinician)',
    description:
      'Summaries already sent keep their record (name and address as sent). A stop of the address ' +
      'stays with the client.',
  })
  @ApiNoContentResponse()
  remove(
    @CurrentActor() actor: Actor,
    @Param('id', ParseUUIDPipe) id: string,
    @Param('contactId', ParseUUIDPipe) contactId: string,
  ): Promise<void> {
    return this.contacts.remove(actor, id, contactId);
  }

  @Post(':contactId/summaries-consent')
  @Roles('clinician')
  @HttpCode(200)
  @ApiOperation({
    summary: 'Record the family’s new consent to summaries after a stop (owning clinician)',
    description:
      'givenOn (not after today) and who gave it. Lifts the stop of the address for the client and ' +
      'ticks this contact as agreeing. An address that was never stopped: 409.',
  })
  @ApiBody({ schema: zodSchemaObject(renewSummariesConsentSchema) })
  @ApiOkResponse({ schema: zodSchemaObject(contactSchema) })
  renewSummariesConsent(
    @CurrentActor() actor: Actor,
    @Param('id', ParseUUIDPipe) id: string,
    @Param('contactId', ParseUUIDPipe) contactId: string,
    @Body(new ZodValidationPipe(renewSummariesConsentSchema)) body: RenewSummariesConsentInput,
  ): Promise<ContactDto> {
    return this.contacts.renewSummariesConsent(actor, id, contactId, body);
  }
}
