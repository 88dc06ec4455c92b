import {
  Column,
  CreateDateColumn,
  Entity,
  Index,
  JoinColumn,
  ManyToOne,
  PrimaryColumn,
  type Relation,
} from 'typeorm';
import { User } from '../users/user.entity';
import { Client } from './client.entity';

// A carer assigned to a client: the only way a carer sees a client.
@Entity({ name: 'client_assignments' })
@Index('IDX_client_assignments_user_id', ['userId'])
export class ClientAssignment {
  @PrimaryColumn({ name: 'client_id', type: 'uuid', primaryKeyConstraintName: 'PK_client_assignments' })
  clientId: string;

  @PrimaryColumn({ name: 'user_id', type: 'uuid', primaryKeyConstraintName: 'PK_client_assignments' })
  userId: string;

  @ManyToOne(() => Client, { onDelete: 'CASCADE', nullable: false })
  @JoinColumn({ name: 'client_id', foreignKeyConstraintName: 'FK_client_assignments_client_id' })
  client?: Relation<Client>;

  @ManyToOne(() => User, { onDelete: 'CASCADE', nullable: false })
  @JoinColumn({ name: 'user_id', foreignKeyConstraintName: 'FK_client_assignments_user_id' })
  user?: Relation<User>;

  @Column({ name: 'assigned_by_id', type: 'uuid', nullable: true })
  assignedById: string | null;

  @ManyToOne(() => User, { onDelete: 'SET NULL', nullable: true })
  @JoinColumn({ name: 'assigned_by_id', foreignKeyConstraintName: 'FK_client_assignments_assigned_by_id' })
  assignedBy?: Relation<User> | null;

  @CreateDateColumn({ name: 'assigned_at', type: 'timestamptz' })
  assignedAt: Date;
}
