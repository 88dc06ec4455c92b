import { Module } from '@nestjs/common';
import { TypeOrmModule } from '@nestjs/typeorm';
import { AuditModule } from '../audit/audit.module';
import { ClinicSettingsController } from './clinic-settings.controller';
import { ClinicSettingsRow } from './clinic-settings.entity';
import { ClinicSettingsService } from './clinic-settings.service';

@Module({
  imports: [TypeOrmModule.forFeature([ClinicSettingsRow]), AuditModule],
  controllers: [ClinicSettingsController],
  providers: [ClinicSettingsService],
  exports: [ClinicSettingsService],
})
export class ClinicModule {}
