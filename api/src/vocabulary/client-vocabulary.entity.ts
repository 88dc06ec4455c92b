import type { ClientVocabulary } from '@keyloom/shared';
import { Check, Column, Entity, Index, JoinColumn, ManyToOne, PrimaryColumn, type Relation } from 'typeorm';
import { Client } from '../clients/client.entity';
import { User } from '../users/user.entity';

// A client's current vocabulary list: what the next profile version freezes into its settings.
@Entity({ name: 'client_vocabularies' })
@Check('CHK_client_vocabularies_revision', `revision >= 0`)
export class ClientVocabularyRow {
  @PrimaryColumn({ name: 'client_id', type: 'uuid', primaryKeyConstraintName: 'PK_client_vocabularies' })
  clientId: string;

  @ManyToOne(() => Client, { onDelete: 'CASCADE', nullable: false })
  @JoinColumn({ name: 'client_id', foreignKeyConstraintName: 'FK_client_vocabularies_client_id' })
  client?: Relation<Client>;

  /** Saves so far; a save names the revision it changed (stale: 409). */
  @Column({ type: 'integer', default: 0 })
  revision: number;

  @Column({ type: 'jsonb' })
  vocabulary: ClientVocabulary;

  /** Spellings the clinician accepted as the client's own (left out of the misspelling review). */
  @Column({ name: 'kept_spellings', type: 'jsonb' })
  keptSpellings: string[];

  @Column({ name: 'updated_at', type: 'timestamptz' })
  updatedAt: Date;

  @Index('IDX_client_vocabularies_updated_by_id')
  @Column({ name: 'updated_by_id', type: 'uuid', nullable: true })
  updatedById: string | null;

  @ManyToOne(() => User, { onDelete: 'SET NULL', nullable: true })
  @JoinColumn({ name: 'updated_by_id', foreignKeyConstraintName: 'FK_client_vocabularies_updated_by_id' })
  updatedBy?: Relation<User> | null;
}
