import { Module } from '@nestjs/common';
import { TypeOrmModule } from '@nestjs/typeorm';
import { AuditModule } from '../audit/audit.module';
import { ClientsModule } from '../clients/clients.module';
import { ConsentsModule } from '../consents/consents.module';
import { JobsModule } from '../jobs/jobs.module';
import { Sample } from '../samples/sample.entity';
import { ExportSigningService } from './export-signing.service';
import { ProfileVersion } from './profile-version.entity';
import { ProfileVersionsController } from './profile-versions.controller';
import { ProfileVersionsService } from './profile-versions.service';

@Module({
  imports: [
    TypeOrmModule.forFeature([ProfileVersion, Sample]),
    ClientsModule,
    ConsentsModule,
    AuditModule,
    JobsModule,
  ],
  controllers: [ProfileVersionsController],
  providers: [ProfileVersionsService, ExportSigningService],
  exports: [ProfileVersionsService],
})
export class ProfileVersionsModule {}
