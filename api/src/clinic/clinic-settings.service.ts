import { Injectable } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import { type ClinicSettings, type ClinicSettingsChanges, DEFAULT_CLINIC_SETTINGS } from '@keyloom/shared';
import { DataSource, type EntityManager } from 'typeorm';
import { AuditService } from '../audit/audit.service';
import type { Actor } from '../auth/session-user';
import { ClinicSettingsRow } from './clinic-settings.entity';

/** The fields an admin sets, in the order the audit lists them. */
const FIELDS = ['name', 'phone', 'address', 'email', 'website'] as const;
type Field = (typeof FIELDS)[number];

/** The one row as the API answers it. */
export const toClinicSettings = (row: ClinicSettingsRow): ClinicSettings => ({
  configured: true,
  name: row.name,
  phone: row.phone,
  address: row.address,
  email: row.email,
  website: row.website,
  updatedAt: row.updatedAt.toISOString(),
  updatedBy: row.updatedBy ? { id: row.updatedBy.id, name: row.updatedBy.name } : null,
});

/**
 * The clinic's details as `manager` sees them, or DEFAULT_CLINIC_SETTINGS: for code outside Nest's
 * injection (the mail worker's steps take a DataSource); everything else calls ClinicSettingsService.get.
 */
export async function loadClinicSettings(manager: EntityManager): Promise<ClinicSettings> {
  const row = await manager
    .getRepository(ClinicSettingsRow)
    .findOne({ where: { id: 1 }, relations: { updatedBy: true } });
  return row ? toClinicSettings(row) : { ...DEFAULT_CLINIC_SETTINGS };
}

@Injectable()
export class ClinicSettingsService {
  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    private readonly audit: AuditService,
  ) {}

  /**
   * The clinic's details (name, phone, address, e-mail, website), or DEFAULT_CLINIC_SETTINGS
   * (`configured: false`, name "the clinic", the rest empty) while an admin has not saved them.
   * @param manager read inside the caller's transaction (e.g. the mail worker's)
   */
  get(manager: EntityManager = this.dataSource.manager): Promise<ClinicSettings> {
    return loadClinicSettings(manager);
  }

  /** Sets every field (admin); audits each changed field as before → after. */
  async update(actor: Actor, input: ClinicSettingsChanges): Promise<ClinicSettings> {
    return this.dataSource.transaction(async (manager) => {
      const repo = manager.getRepository(ClinicSettingsRow);
      // Locked, so two admins saving at once each audit against what the other left.
      const before = await repo.findOne({ where: { id: 1 }, lock: { mode: 'pessimistic_write' } });
      const changes: Partial<Record<Field, { from: string | null; to: string | null }>> = {};
      for (const field of FIELDS) {
        const from = before ? before[field] : null;
        if (from !== input[field]) changes[field] = { from, to: input[field] };
      }
      if (before && Object.keys(changes).length === 0) return this.get(manager);
      await manager.query(
        `INSERT INTO clinic_settings (id, name, phone, address, email, website, updated_by_id)
         VALUES (1, $1, $2, $3, $4, $5, $6)
         ON CONFLICT (id) DO UPDATE SET name = EXCLUDED.name, phone = EXCLUDED.phone,
           address = EXCLUDED.address, email = EXCLUDED.email, website = EXCLUDED.website,
           updated_by_id = EXCLUDED.updated_by_id, updated_at = now()`,
        [...FIELDS.map((field) => input[field]), actor.id],
      );
      await this.audit.record(
        actor,
        'clinic-settings.update',
        { type: 'clinic_settings', id: '1' },
        { changes },
        manager,
      );
      return this.get(manager);
    });
  }
}
