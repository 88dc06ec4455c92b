import { Module } from '@nestjs/common';
import { TypeOrmModule } from '@nestjs/typeorm';
import { AuditModule } from '../audit/audit.module';
import { ClientsModule } from '../clients/clients.module';
import { ProfileVersionsModule } from '../profile-versions/profile-versions.module';
import { ClientVocabularyRow } from './client-vocabulary.entity';
import { VersionVocabularyService } from './version-vocabulary.service';
import { VocabularyController } from './vocabulary.controller';
import { VocabularyService } from './vocabulary.service';

@Module({
  imports: [
    TypeOrmModule.forFeature([ClientVocabularyRow]),
    ClientsModule,
    ProfileVersionsModule,
    AuditModule,
  ],
  controllers: [VocabularyController],
  providers: [VocabularyService, VersionVocabularyService],
})
export class VocabularyModule {}
