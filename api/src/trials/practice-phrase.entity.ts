import {
  Column,
  CreateDateColumn,
  Entity,
  Index,
  JoinColumn,
  ManyToOne,
  PrimaryGeneratedColumn,
  type Relation,
} from 'typeorm';
import { Client } from '../clients/client.entity';
import { User } from '../users/user.entity';

// A practice phrase the clinician added for one client (Keyloom's own list lives in shared).
// The unique index on (client_id, lower(text)) is an expression index, created by the migration;
// synchronize: false tells TypeORM's schema check it exists and is not its to manage.
@Entity({ name: 'practice_phrases' })
@Index('UQ_practice_phrases_client_text', { synchronize: false })
export class PracticePhraseRow {
  @PrimaryGeneratedColumn('uuid', { primaryKeyConstraintName: 'PK_practice_phrases' })
  id: string;

  @Column({ name: 'client_id', type: 'uuid' })
  clientId: string;

  @ManyToOne(() => Client, { onDelete: 'CASCADE', nullable: false })
  @JoinColumn({ name: 'client_id', foreignKeyConstraintName: 'FK_practice_phrases_client_id' })
  client?: Relation<Client>;

  @Column({ type: 'text' })
  text: string;

  @Column({ name: 'added_by_id', type: 'uuid', nullable: true })
  addedById: string | null;

  @ManyToOne(() => User, { onDelete: 'SET NULL', nullable: true })
  @JoinColumn({ name: 'added_by_id', foreignKeyConstraintName: 'FK_practice_phrases_added_by_id' })
  addedBy?: Relation<User> | null;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;
}
