import { Module } from '@nestjs/common';
import { AuditModule } from '../audit/audit.module';
import { ClientsModule } from '../clients/clients.module';
import { ProfileVersionsModule } from '../profile-versions/profile-versions.module';
import { ReportsController } from './reports.controller';
import { ReportsService } from './reports.service';

// The printed reports of a version and of a client over a period: data for the print view and PDFs.
@Module({
  imports: [ClientsModule, ProfileVersionsModule, AuditModule],
  controllers: [ReportsController],
  providers: [ReportsService],
})
export class ReportsModule {}
