import { Injectable } from '@nestjs/common';
import { InjectRepository } from '@nestjs/typeorm';
import {
  type AuditEventView,
  type AuditFilter,
  auditActionLabels,
  type AuditPage,
  type AuditQuery,
} from '@keyloom/shared';
import Papa from 'papaparse';
import { In, type Repository, type SelectQueryBuilder } from 'typeorm';
import { Client } from '../clients/client.entity';
import { User } from '../users/user.entity';
import { AuditEvent } from './audit-event.entity';
import { auditSentence } from './audit-sentence';

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

/** Who a page of events mentions, by user id: name and role now. */
type People = ReadonlyMap<string, { name: string; role: string }>;

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/** Reading the audit log (supervisor, admin): filters, paging, newest first, in plain words. */
@Injectable()
export class AuditLogService {
  constructor(@InjectRepository(AuditEvent) private readonly events: Repository<AuditEvent>) {}

  /**
   * One page of events. `action` is exact ("consent.withdraw") or a prefix ending in "." ("sample.");
   * `from`/`to` are calendar days, both included (server time zone).
   */
  async find(query: AuditQuery): Promise<AuditPage> {
    const q = this.filtered(query);
    const total = await q.clone().getCount();
    const rows = await this.selected(q)
      .offset((query.page - 1) * query.pageSize)
      .limit(query.pageSize)
      .getRawMany<AuditRow>();
    const people = await this.peopleOf(rows);
    return {
      items: rows.map((row) => toView(row, people)),
      total,
      page: query.page,
      pageSize: query.pageSize,
    };
  }

  /**
   * Every event matching the filters, newest first, as CSV: time (ISO), person, role (now), action,
   * sentence, client. RFC 4180 by papaparse's `unparse`; a cell a spreadsheet would run as a formula
   * gets a leading ' (OWASP, "CSV Injection": `escapeFormulae`).
   */
  async csv(filter: AuditFilter): Promise<string> {
    const rows = await this.selected(this.filtered(filter)).getRawMany<AuditRow>();
    const people = await this.peopleOf(rows);
    const data = rows.map((row) => {
      const view = toView(row, people);
      const actor = row.actor_id ? people.get(row.actor_id) : undefined;
      return [
        view.at,
        view.actorName ?? view.actorEmail ?? 'Keyloom',
        actor?.role ?? '',
        (auditActionLabels as Record<string, string>)[view.action] ?? view.action,
        view.sentence,
        view.clientPseudonym ?? '',
      ];
    });
    return Papa.unparse(
      { fields: ['time', 'person', 'role', 'action', 'sentence', 'client'], data },
      { newline: '\r\n', escapeFormulae: true, header: true },
    );
  }

  private filtered(query: AuditFilter) {
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
    return q;
  }

  private selected(q: SelectQueryBuilder<AuditEvent>) {
    return q
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
      .addOrderBy('event.id', 'DESC');
  }

  /** The users the rows mention (actors, user subjects, carers in the details): one query for all. */
  private async peopleOf(rows: readonly AuditRow[]): Promise<People> {
    const ids = new Set<string>();
    for (const row of rows) {
      if (row.actor_id) ids.add(row.actor_id);
      if (row.subject_type === 'user' && row.subject_id) ids.add(row.subject_id);
      const carerId = row.details?.carerId;
      if (typeof carerId === 'string') ids.add(carerId);
    }
    const wanted = [...ids].filter((id) => UUID.test(id));
    if (wanted.length === 0) return new Map();
    const users = await this.events.manager
      .getRepository(User)
      .find({ select: { id: true, name: true, role: true }, where: { id: In(wanted) } });
    return new Map(users.map((user) => [user.id, { name: user.name, role: user.role }]));
  }
}

function toView(row: AuditRow, people: People): AuditEventView {
  const details = row.details ?? {};
  const actorName = (row.actor_id && people.get(row.actor_id)?.name) || null;
  const userNames = new Map([...people].map(([id, person]) => [id, person.name]));
  return {
    id: row.id,
    at: new Date(row.at).toISOString(),
    actorId: row.actor_id,
    actorEmail: row.actor_email,
    actorName,
    action: row.action,
    subjectType: row.subject_type,
    subjectId: row.subject_id,
    clientId: row.client_id,
    clientPseudonym: row.client_pseudonym,
    details,
    ip: row.ip,
    sentence: auditSentence({
      action: row.action,
      actorName,
      actorEmail: row.actor_email,
      subjectType: row.subject_type,
      subjectId: row.subject_id,
      clientPseudonym: row.client_pseudonym,
      details,
      userNames,
    }),
  };
}
