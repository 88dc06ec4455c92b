import { Body, Controller, Get, Param, ParseUUIDPipe, Patch, Post } from '@nestjs/common';
import { ApiBody, ApiCreatedResponse, ApiOkResponse, ApiOperation, ApiTags } from '@nestjs/swagger';
import {
  contactSchema,
  type CreateContactInput,
  createContactSchema,
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
  @ApiOperation({ summary: 'Add a family contact (owning clinician)' })
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
  @ApiOperation({ summary: 'Change a family contact (owning clinician)' })
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
}
