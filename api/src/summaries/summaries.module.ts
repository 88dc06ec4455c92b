import { Module } from '@nestjs/common';
import { TypeOrmModule } from '@nestjs/typeorm';
import { AuditModule } from '../audit/audit.module';
import { ClientsModule } from '../clients/clients.module';
import { ClinicModule } from '../clinic/clinic.module';
import { ConsentsModule } from '../consents/consents.module';
import { IdempotencyModule } from '../idempotency/idempotency.module';
import { JobsModule } from '../jobs/jobs.module';
import { StopPageContextService } from './stop-page-context';
import { SummariesController } from './summaries.controller';
import { SummariesService } from './summaries.service';
import { SummaryRecipient } from './summary-recipient.entity';
import { Summary } from './summary.entity';

@Module({
  imports: [
    TypeOrmModule.forFeature([Summary, SummaryRecipient]),
    ClientsModule,
    ClinicModule,
    ConsentsModule,
    AuditModule,
    JobsModule,
    IdempotencyModule,
  ],
  controllers: [SummariesController],
  providers: [SummariesService, StopPageContextService],
})
export class SummariesModule {}
