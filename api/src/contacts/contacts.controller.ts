import { Body, Controller, Get, Ip, Param, ParseUUIDPipe, Patch, Post } from '@nestjs/common';
import { ApiBody, ApiCreatedResponse, ApiOkResponse, ApiOperation, ApiTags } from '@nestjs/swagger';
import {
  contactSchema,
  type CreateContactInput,
  createContactSchema,
  type SessionUser,
  type UpdateContactInput,
  updateContactSchema,
} from '@keyloom/shared';
import { z } from 'zod';
import { CurrentUser } from '../auth/decorators/current-user.decorator';
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
  findAll(
    @CurrentUser() user: SessionUser,
    @Ip() ip: string,
    @Param('id', ParseUUIDPipe) id: string,
  ): Promise<ContactDto[]> {
    return this.contacts.findAll({ ...user, ip }, id);
  }

  @Post()
  @Roles('clinician')
  @ApiOperation({ summary: 'Add a family contact (owning clinician)' })
  @ApiBody({ schema: zodSchemaObject(createContactSchema) })
  @ApiCreatedResponse({ schema: zodSchemaObject(contactSchema) })
  create(
    @CurrentUser() user: SessionUser,
    @Ip() ip: string,
    @Param('id', ParseUUIDPipe) id: string,
    @Body(new ZodValidationPipe(createContactSchema)) body: CreateContactInput,
  ): Promise<ContactDto> {
    return this.contacts.create({ ...user, ip }, id, body);
  }

  @Patch(':contactId')
  @Roles('clinician')
  @ApiOperation({ summary: 'Change a family contact (owning clinician)' })
  @ApiBody({ schema: zodSchemaObject(updateContactSchema) })
  @ApiOkResponse({ schema: zodSchemaObject(contactSchema) })
  update(
    @CurrentUser() user: SessionUser,
    @Ip() ip: string,
    @Param('id', ParseUUIDPipe) id: string,
    @Param('contactId', ParseUUIDPipe) contactId: string,
    @Body(new ZodValidationPipe(updateContactSchema)) body: UpdateContactInput,
  ): Promise<ContactDto> {
    return this.contacts.update({ ...user, ip }, id, contactId, body);
  }
}
