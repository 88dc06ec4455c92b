import { Module } from '@nestjs/common';
import { TypeOrmModule } from '@nestjs/typeorm';
import { AuditModule } from '../audit/audit.module';
import { ClientsModule } from '../clients/clients.module';
import { ContactsController } from './contacts.controller';
import { ContactsService } from './contacts.service';
import { FamilyContact } from './family-contact.entity';
import { SummaryStop } from './summary-stop.entity';

@Module({
  imports: [TypeOrmModule.forFeature([FamilyContact, SummaryStop]), ClientsModule, AuditModule],
  controllers: [ContactsController],
  providers: [ContactsService],
})
export class ContactsModule {}
