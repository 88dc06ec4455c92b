import { Injectable, Logger } from '@nestjs/common';
import type { AuditAction } from '@keyloom/shared';
import { InjectRepository } from '@nestjs/typeorm';
import type { EntityManager, Repository } from 'typeorm';
import { withoutClientText } from './audit-details';
import { AuditEvent, type AuditDetails } from './audit-event.entity';

/** Every action the log records: the keys of `auditActionLabels` in @keyloom/shared. */
export type { AuditAction };

/** Who did it: a signed-in user, or only a typed e-mail (failed sign-in); ip of the request. */
export type AuditActor = { id: string | null; email: string | null; ip?: string | null };

/** What it was done to; clientId ties the event to one client record (later issues). */
export type AuditSubject = { type: string; id: string; clientId?: string | null };

@Injectable()
export class AuditService {
  private readonly logger = new Logger('Audit');

  constructor(@InjectRepository(AuditEvent) private readonly events: Repository<AuditEvent>) {}

  /**
   * Appends one event. Pass `manager` to write inside the caller's transaction, so the event
   * exists exactly when the change does. `details` must not contain secrets or password hashes.
   * For an event about a client (subject.clientId set) the keys of free text (CLIENT_TEXT_KEYS) are
   * left out, whatever the caller passed, and a warning names them so the caller gets fixed.
   */
  async record(
    actor: AuditActor | null,
    action: AuditAction,
    subject: AuditSubject | null,
    details: AuditDetails = {},
    manager?: EntityManager,
  ): Promise<void> {
    const repo = manager ? manager.getRepository(AuditEvent) : this.events;
    if (subject?.clientId) {
      const checked = withoutClientText(details);
      if (checked.removed.length > 0) {
        this.logger.warn(`Left client text out of the ${action} event: ${checked.removed.join(', ')}`);
      }
      details = checked.details;
    }
    // save(create()) rather than insert(): insert's deep-partial type does not accept free-form jsonb.
    await repo.save(
      repo.create({
        actorId: actor?.id ?? null,
        actorEmail: actor?.email ?? null,
        ip: actor?.ip ?? null,
        action,
        subjectType: subject?.type ?? null,
        subjectId: subject?.id ?? null,
        clientId: subject?.clientId ?? null,
        details,
      }),
    );
  }
}
