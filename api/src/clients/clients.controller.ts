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
  assignmentSchema,
  type CreateAssignmentInput,
  createAssignmentSchema,
  type CreateClientInput,
  createClientSchema,
  clientSchema,
  clientSummarySchema,
  personRefSchema,
  type UpdateClientInput,
  updateClientSchema,
} from '@keyloom/shared';
import { z } from 'zod';
import { CurrentActor } from '../auth/decorators/current-user.decorator';
import type { Actor } from '../auth/session-user';
import { Roles } from '../auth/decorators/roles.decorator';
import { zodSchemaObject } from '../common/openapi/zod-schema-object';
import { ZodValidationPipe } from '../common/pipes/zod-validation.pipe';
import { ClientsService } from './clients.service';
import type { Assignment, CarerOption, ClientDto, ClientSummary } from './dto/client.dto';

@ApiTags('clients')
@Controller('clients')
export class ClientsController {
  constructor(private readonly clients: ClientsService) {}

  @Get()
  @ApiOperation({
    summary: 'The caseload the caller may see',
    description:
      'Clinician: own clients. Carer: assigned clients. Supervisor and admin: every client (admins get ' +
      'these summaries only, to assign carers).',
  })
  @ApiOkResponse({ schema: zodSchemaObject(z.array(clientSummarySchema)) })
  findAll(@CurrentActor() actor: Actor): Promise<ClientSummary[]> {
    return this.clients.findAll(actor);
  }

  @Post()
  @Roles('clinician')
  @ApiOperation({ summary: 'Create a client in the caller’s own caseload (clinician)' })
  @ApiBody({ schema: zodSchemaObject(createClientSchema) })
  @ApiCreatedResponse({ schema: zodSchemaObject(clientSchema) })
  create(
    @CurrentActor() actor: Actor,
    @Body(new ZodValidationPipe(createClientSchema)) body: CreateClientInput,
  ): Promise<ClientDto> {
    return this.clients.create(actor, body);
  }

  @Get(':id')
  @ApiOperation({
    summary: 'One client (owning clinician, supervisor, assigned carer without notes)',
    description: 'Another clinician’s client, an unassigned one or a made-up id: 404. Admin: 403.',
  })
  @ApiOkResponse({ schema: zodSchemaObject(clientSchema) })
  findOne(@CurrentActor() actor: Actor, @Param('id', ParseUUIDPipe) id: string): Promise<ClientDto> {
    return this.clients.findOne(actor, id);
  }

  @Patch(':id')
  @Roles('clinician')
  @ApiOperation({ summary: 'Change a client (owning clinician)' })
  @ApiBody({ schema: zodSchemaObject(updateClientSchema) })
  @ApiOkResponse({ schema: zodSchemaObject(clientSchema) })
  update(
    @CurrentActor() actor: Actor,
    @Param('id', ParseUUIDPipe) id: string,
    @Body(new ZodValidationPipe(updateClientSchema)) body: UpdateClientInput,
  ): Promise<ClientDto> {
    return this.clients.update(actor, id, body);
  }

  @Get(':id/assignments')
  @ApiOperation({ summary: 'Carers assigned to a client (anyone who sees the client)' })
  @ApiOkResponse({ schema: zodSchemaObject(z.array(assignmentSchema)) })
  listAssignments(
    @CurrentActor() actor: Actor,
    @Param('id', ParseUUIDPipe) id: string,
  ): Promise<Assignment[]> {
    return this.clients.listAssignments(actor, id);
  }

  @Post(':id/assignments')
  @Roles('clinician', 'admin')
  @ApiOperation({
    summary: 'Assign a carer (owning clinician or admin)',
    description: '400 "Choose an active carer." unless userId is an active carer; 409 when already assigned.',
  })
  @ApiBody({ schema: zodSchemaObject(createAssignmentSchema) })
  @ApiCreatedResponse({ schema: zodSchemaObject(assignmentSchema) })
  assign(
    @CurrentActor() actor: Actor,
    @Param('id', ParseUUIDPipe) id: string,
    @Body(new ZodValidationPipe(createAssignmentSchema)) body: CreateAssignmentInput,
  ): Promise<Assignment> {
    return this.clients.assign(actor, id, body);
  }

  @Delete(':id/assignments/:userId')
  @Roles('clinician', 'admin')
  @HttpCode(204)
  @ApiOperation({ summary: 'Remove a carer’s assignment (owning clinician or admin)' })
  @ApiNoContentResponse({ description: 'Removed.' })
  unassign(
    @CurrentActor() actor: Actor,
    @Param('id', ParseUUIDPipe) id: string,
    @Param('userId', ParseUUIDPipe) userId: string,
  ): Promise<void> {
    return this.clients.unassign(actor, id, userId);
  }

  @Get(':id/carers-available')
  @Roles('clinician', 'admin')
  @ApiOperation({ summary: 'Active carers not yet assigned to the client (owning clinician or admin)' })
  @ApiOkResponse({ schema: zodSchemaObject(z.array(personRefSchema.extend({ email: z.string() }))) })
  carersAvailable(
    @CurrentActor() actor: Actor,
    @Param('id', ParseUUIDPipe) id: string,
  ): Promise<CarerOption[]> {
    return this.clients.carersAvailable(actor, id);
  }
}
