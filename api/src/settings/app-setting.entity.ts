import { Column, CreateDateColumn, Entity, PrimaryColumn } from 'typeorm';

// Values the installation makes for itself and keeps (not configuration from the environment), e.g.
// the key that signs exported profile files. Shared by the API and the worker through the database.
@Entity({ name: 'app_settings' })
export class AppSetting {
  @PrimaryColumn({ type: 'text', primaryKeyConstraintName: 'PK_app_settings' })
  name: string;

  @Column({ type: 'text' })
  value: string;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;
}
