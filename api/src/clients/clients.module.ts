import { Module } from '@nestjs/common';
import { TypeOrmModule } from '@nestjs/typeorm';
import { AuditModule } from '../audit/audit.module';
import { Consent } from '../consents/consent.entity';
import { User } from '../users/user.entity';
import { ClientAccessService } from './client-access.service';
import { ClientAssignment } from './client-assignment.entity';
import { Client } from './client.entity';
import { ClientsController } from './clients.controller';
import { ClientsService } from './clients.service';

@Module({
  imports: [TypeOrmModule.forFeature([Client, ClientAssignment, Consent, User]), AuditModule],
  controllers: [ClientsController],
  providers: [ClientAccessService, ClientsService],
  exports: [ClientAccessService],
})
export class ClientsModule {}
