import { Module } from '@nestjs/common';
import { TypeOrmModule } from '@nestjs/typeorm';
import { AuditModule } from '../audit/audit.module';
import { ClientsModule } from '../clients/clients.module';
import { Consent } from './consent.entity';
import { ConsentsController } from './consents.controller';
import { ConsentsService } from './consents.service';
import { WithdrawalHooks } from './withdrawal-hooks';

@Module({
  imports: [TypeOrmModule.forFeature([Consent]), ClientsModule, AuditModule],
  controllers: [ConsentsController],
  providers: [ConsentsService, WithdrawalHooks],
  exports: [WithdrawalHooks],
})
export class ConsentsModule {}
