import {
  Column,
  CreateDateColumn,
  Entity,
  Index,
  JoinColumn,
  ManyToOne,
  PrimaryGeneratedColumn,
  type Relation,
  UpdateDateColumn,
} from 'typeorm';
import { Client } from '../clients/client.entity';

// A family member who may receive progress summaries (no account).
@Entity({ name: 'family_contacts' })
@Index('IDX_family_contacts_client_id', ['clientId'])
// Unique (client_id, lower(email)) WHERE NOT legacy_duplicate_email: an expression index TypeORM
// cannot describe, so it lives in the migration only (ContactAddresses1764980000002).
@Index('UQ_family_contacts_client_email', { synchronize: false })
export class FamilyContact {
  @PrimaryGeneratedColumn('uuid', { primaryKeyConstraintName: 'PK_family_contacts' })
  id: string;

  @Column({ name: 'client_id', type: 'uuid' })
  clientId: string;

  @ManyToOne(() => Client, { onDelete: 'RESTRICT', nullable: false })
  @JoinColumn({ name: 'client_id', foreignKeyConstraintName: 'FK_family_contacts_client_id' })
  client?: Relation<Client>;

  @Column({ type: 'text' })
  name: string;

  @Column({ type: 'text' })
  relationship: string;

  @Column({ type: 'text' })
  email: string;

  @Column({ name: 'consent_to_summaries', type: 'boolean' })
  consentToSummaries: boolean;

  @Column({ name: 'unsubscribed_at', type: 'timestamptz', nullable: true })
  unsubscribedAt: Date | null;

  // True for the extra contacts sharing an address that existed before addresses were unique.
  @Column({ name: 'legacy_duplicate_email', type: 'boolean', default: false })
  legacyDuplicateEmail: boolean;

  // The family's renewed consent to summaries after a stop: the day and who gave it.
  @Column({ name: 'summaries_consent_given_on', type: 'date', nullable: true })
  summariesConsentGivenOn: string | null;

  @Column({ name: 'summaries_consent_given_by', type: 'text', nullable: true })
  summariesConsentGivenBy: string | null;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;

  @UpdateDateColumn({ name: 'updated_at', type: 'timestamptz' })
  updatedAt: Date;
}
