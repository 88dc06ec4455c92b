import { Body, Controller, Get, Param, ParseUUIDPipe, Patch, Post } from '@nestjs/common';
import { ApiBody, ApiOperation, ApiTags } from '@nestjs/swagger';
import {
  type CreateUserInput,
  createUserSchema,
  type UpdateUserInput,
  updateUserSchema,
} from '@keyloom/shared';
import { CurrentActor } from '../auth/decorators/current-user.decorator';
import type { Actor } from '../auth/session-user';
import { Roles } from '../auth/decorators/roles.decorator';
import { zodSchemaObject } from '../common/openapi/zod-schema-object';
import { ZodValidationPipe } from '../common/pipes/zod-validation.pipe';
import type { UserDto } from './dto/user.dto';
import { UsersService } from './users.service';

@ApiTags('users')
@Controller('users')
@Roles('admin')
export class UsersController {
  constructor(private readonly users: UsersService) {}

  @Get()
  @ApiOperation({ summary: 'List staff accounts (admin)' })
  findAll(): Promise<UserDto[]> {
    return this.users.findAll();
  }

  @Post()
  @ApiOperation({ summary: 'Create a staff account (admin)' })
  @ApiBody({ schema: zodSchemaObject(createUserSchema) })
  create(
    @CurrentActor() actor: Actor,
    @Body(new ZodValidationPipe(createUserSchema)) body: CreateUserInput,
  ): Promise<UserDto> {
    return this.users.create(actor, body);
  }

  @Patch(':id')
  @ApiOperation({ summary: 'Change name, role or active of a staff account (admin)' })
  @ApiBody({ schema: zodSchemaObject(updateUserSchema) })
  update(
    @CurrentActor() actor: Actor,
    @Param('id', ParseUUIDPipe) id: string,
    @Body(new ZodValidationPipe(updateUserSchema)) body: UpdateUserInput,
  ): Promise<UserDto> {
    return this.users.update(actor, id, body);
  }
}
