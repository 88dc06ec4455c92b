import { Injectable } from '@nestjs/common';
import { InjectRepository } from '@nestjs/typeorm';
import type { EntityManager, Repository } from 'typeorm';
import { AuditEvent, type AuditDetails } from './audit-event.entity';

/** Actions recorded so far; later issues add theirs ('client.create', 'profile.approve', …). */
export type AuditAction =
  | 'auth.sign-in'
  | 'auth.sign-in-failed'
  | 'auth.sign-out'
  | 'user.create'
  | 'user.update'
  // Issue 4: caseload, consent, contacts, language samples (clientId set on each).
  | 'client.create'
  | 'client.update'
  | 'assignment.create'
  | 'assignment.delete'
  | 'consent.create'
  | 'consent.withdraw'
  | 'consent.document-upload'
  | 'contact.create'
  | 'contact.update'
  | 'sample.upload'
  | 'sample.paste'
  | 'sample.duplicate-refused'
  | 'sample.flag-redact'
  | 'sample.flag-keep'
  | 'sample.exclude'
  | 'sample.delete'
  // Issue 5: profile versions (clientId set on each).
  | 'profile.create'
  | 'profile.train'
  | 'profile.cancel'
  | 'profile.trained'
  | 'profile.failed'
  | 'profile.sign-off'
  | 'profile.approve'
  | 'profile.send-back'
  | 'profile.retire'
  | 'profile.export'
  | 'profile.delete'
  // Issue 6: test keyboard (clientId set on each).
  | 'profile.model-download'
  | 'profile.report-problem'
  | 'trial.create'
  | 'practice-phrase.create'
  | 'practice-phrase.delete'
  // Issue 7: progress summaries (clientId set on each; the mail job records with no actor).
  | 'summary.create'
  | 'summary.resend'
  | 'summary.sent'
  | 'summary.failed'
  | 'summary.stop';

/** Who did it: a signed-in user, or only a typed e-mail (failed sign-in); ip of the request. */
export type AuditActor = { id: string | null; email: string | null; ip?: string | null };

/** What it was done to; clientId ties the event to one client record (later issues). */
export type AuditSubject = { type: string; id: string; clientId?: string | null };

@Injectable()
export class AuditService {
  constructor(@InjectRepository(AuditEvent) private readonly events: Repository<AuditEvent>) {}

  /**
   * Appends one event. Pass `manager` to write inside the caller's transaction, so the event
   * exists exactly when the change does. `details` must not contain secrets or password hashes.
   */
  async record(
    actor: AuditActor | null,
    action: AuditAction,
    subject: AuditSubject | null,
    details: AuditDetails = {},
    manager?: EntityManager,
  ): Promise<void> {
    const repo = manager ? manager.getRepository(AuditEvent) : this.events;
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
