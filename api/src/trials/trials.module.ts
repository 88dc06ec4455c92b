import { Module } from '@nestjs/common';
import { TypeOrmModule } from '@nestjs/typeorm';
import { AuditModule } from '../audit/audit.module';
import { ClientsModule } from '../clients/clients.module';
import { ConsentsModule } from '../consents/consents.module';
import { ProfileVersionsModule } from '../profile-versions/profile-versions.module';
import { ModelDownloadController } from './model-download.controller';
import { ModelDownloadService } from './model-download.service';
import { PracticePhraseRow } from './practice-phrase.entity';
import { PracticePhrasesController } from './practice-phrases.controller';
import { PracticePhrasesService } from './practice-phrases.service';
import { Trial } from './trial.entity';
import { TrialsController } from './trials.controller';
import { TrialsService } from './trials.service';

// The test keyboard's API: model downloads, trials, practice phrases.
@Module({
  imports: [
    TypeOrmModule.forFeature([Trial, PracticePhraseRow]),
    ClientsModule,
    ConsentsModule,
    AuditModule,
    ProfileVersionsModule,
  ],
  controllers: [ModelDownloadController, TrialsController, PracticePhrasesController],
  providers: [ModelDownloadService, TrialsService, PracticePhrasesService],
})
export class TrialsModule {}
