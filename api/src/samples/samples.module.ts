import { Module } from '@nestjs/common';
import { TypeOrmModule } from '@nestjs/typeorm';
import { AuditModule } from '../audit/audit.module';
import { ClientsModule } from '../clients/clients.module';
import { ConsentsModule } from '../consents/consents.module';
import { LexiconService } from './lexicon.service';
import { SampleFilesInterceptor } from './sample-files.interceptor';
import { SampleFlag } from './sample-flag.entity';
import { Sample } from './sample.entity';
import { SamplesController } from './samples.controller';
import { SamplesService } from './samples.service';

@Module({
  imports: [TypeOrmModule.forFeature([Sample, SampleFlag]), ClientsModule, ConsentsModule, AuditModule],
  controllers: [SamplesController],
  providers: [SamplesService, LexiconService, SampleFilesInterceptor],
  exports: [SamplesService, LexiconService],
})
export class SamplesModule {}
