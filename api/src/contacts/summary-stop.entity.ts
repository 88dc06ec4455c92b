import { Check, Column, Entity, JoinColumn, ManyToOne, PrimaryColumn, type Relation } from 'typeorm';
import { Client } from '../clients/client.entity';

// An address that asked (through the stop link) for no more summaries about this client. Kept per
// address, not per contact: deleting or re-adding the contact, or giving another contact the address,
// does not undo it. Only the family's new consent, recorded by the clinician, removes the row.
@Entity({ name: 'summary_stops' })
@Check('CHK_summary_stops_email_key', `email_key = lower(email_key)`)
export class SummaryStop {
  @PrimaryColumn({ name: 'client_id', type: 'uuid', primaryKeyConstraintName: 'PK_summary_stops' })
  clientId: string;

  // The address in lower case (addresses are compared case-insensitively).
  @PrimaryColumn({ name: 'email_key', type: 'text', primaryKeyConstraintName: 'PK_summary_stops' })
  emailKey: string;

  @ManyToOne(() => Client, { onDelete: 'CASCADE', nullable: false })
  @JoinColumn({ name: 'client_id', foreignKeyConstraintName: 'FK_summary_stops_client_id' })
  client?: Relation<Client>;

  @Column({ name: 'stopped_at', type: 'timestamptz', default: () => 'now()' })
  stoppedAt: Date;
}
