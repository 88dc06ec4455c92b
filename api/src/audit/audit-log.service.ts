import { Injectable } from '@nestjs/common';
import { InjectRepository } from '@nestjs/typeorm';
import type { AuditEventView, AuditPage, AuditQuery } from '@keyloom/shared';
import type { Repository } from 'typeorm';
import { Client } from '../clients/client.entity';
import { AuditEvent } from './audit-event.entity';

type AuditRow = {
  id: string;
  at: Date;
  actor_id: string | null;
  actor_email: string | null;
  action: string;
  subject_type: string | null;
  subject_id: string | null;
  client_id: string | null;
  client_pseudonym: string | null;
  details: Record<string, unknown> | null;
  ip: string | null;
};

/** Reading the audit log (supervisor, admin): filters, paging, newest first, with the client pseudonym. */
@Injectable()
export class AuditLogService {
  constructor(@InjectRepository(AuditEvent) private readonly events: Repository<AuditEvent>) {}

  /**
   * One page of events. `action` is exact ("consent.withdraw") or a prefix ending in "." ("sample.");
   * `from`/`to` are calendar days, both included (server time zone).
   */
  async find(query: AuditQuery): Promise<AuditPage> {
    const q = this.events
      .createQueryBuilder('event')
      .leftJoin(Client, 'client', 'client.id = event.clientId');
    if (query.clientId) q.andWhere('event.clientId = :clientId', { clientId: query.clientId });
    if (query.userId) q.andWhere('event.actorId = :userId', { userId: query.userId });
    if (query.action) {
      if (query.action.endsWith('.')) {
        // LIKE with the prefix's own wildcards escaped.
        const prefix = query.action.replace(/[\\%_]/g, (c) => `\\${c}`);
        q.andWhere(`event.action LIKE :prefix ESCAPE '\\'`, { prefix: `${prefix}%` });
      } else {
        q.andWhere('event.action = :action', { action: query.action });
      }
    }
    if (query.from) q.andWhere('event.at >= CAST(:from AS date)', { from: query.from });
    if (query.to) q.andWhere(`event.at < CAST(:to AS date) + 1`, { to: query.to });

    const total = await q.clone().getCount();
    const rows = await q
      .select([
        'event.id AS id',
        'event.at AS at',
        'event.actor_id AS actor_id',
        'event.actor_email AS actor_email',
        'event.action AS action',
        'event.subject_type AS subject_type',
        'event.subject_id AS subject_id',
        'event.client_id AS client_id',
        'client.pseudonym AS client_pseudonym',
        'event.details AS details',
        'event.ip AS ip',
      ])
      .orderBy('event.at', 'DESC')
      .addOrderBy('event.id', 'DESC')
      .offset((query.page - 1) * query.pageSize)
      .limit(query.pageSize)
      .getRawMany<AuditRow>();
    return { items: rows.map(toView), total, page: query.page, pageSize: query.pageSize };
  }
}

function toView(row: AuditRow): AuditEventView {
  return {
    id: row.id,
    at: new Date(row.at).toISOString(),
    actorId: row.actor_id,
    actorEmail: row.actor_email,
    action: row.action,
    subjectType: row.subject_type,
    subjectId: row.subject_id,
    clientId: row.client_id,
    clientPseudonym: row.client_pseudonym,
    details: row.details ?? {},
    ip: row.ip,
  };
}
