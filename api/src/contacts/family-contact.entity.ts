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

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;

  @UpdateDateColumn({ name: 'updated_at', type: 'timestamptz' })
  updatedAt: Date;
}
