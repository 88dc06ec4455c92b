import { ConflictException, ForbiddenException, Injectable, NotFoundException } from '@nestjs/common';
import { InjectRepository } from '@nestjs/typeorm';
import type { Role, SessionUser } from '@keyloom/shared';
import type { EntityManager, Repository } from 'typeorm';
import { WRONG_ROLE_MESSAGE } from '../auth/session-user';
import { Consent } from '../consents/consent.entity';
import { todayIso } from '../consents/consent-status';
import { ClientAssignment } from './client-assignment.entity';
import { Client } from './client.entity';

export const CLIENT_NOT_FOUND_MESSAGE = 'There is no client with that id in your caseload.';
export const NO_TRAINING_CONSENT_MESSAGE =
  'This client has no active consent for model training. Record consent first.';

/**
 * What an actor wants to read about a client:
 * - `client`: the summary (pseudonym, access method, clinician, carers) — every role that sees the client;
 * - `clinical`: the client page (timings, goals; later profile versions) — not admins;
 * - `samples`, `consents`, `contacts`: clinician and supervisor only.
 */
export type ClientReadWhat = 'client' | 'clinical' | 'samples' | 'consents' | 'contacts';
/** Reads, plus `own` (any change to the client's records) and `assign` (carer assignments). */
export type ClientAction = ClientReadWhat | 'own' | 'assign';
/** How the actor stands to this client: its clinician, an assigned carer, or neither. */
export type ClientRelation = 'owner' | 'assigned' | 'none';
export type AccessDecision = 'allow' | 'forbidden' | 'not-found';
export type AccessActor = Pick<SessionUser, 'id' | 'role'>;

const READERS: Record<ClientReadWhat, readonly Role[]> = {
  client: ['clinician', 'supervisor', 'carer', 'admin'],
  clinical: ['clinician', 'supervisor', 'carer'],
  samples: ['clinician', 'supervisor'],
  consents: ['clinician', 'supervisor'],
  contacts: ['clinician', 'supervisor'],
};

/**
 * The access matrix, pure. A client the actor may not even know of is "not-found" (the same answer
 * as a made-up id): clinicians see their own caseload, carers their assigned clients, supervisors
 * and admins every client. Within sight, the action decides "allow" or "forbidden" (403).
 */
export function decideClientAccess(
  role: Role,
  relation: ClientRelation,
  action: ClientAction,
): AccessDecision {
  const visible =
    role === 'supervisor' ||
    role === 'admin' ||
    (role === 'clinician' && relation === 'owner') ||
    (role === 'carer' && relation === 'assigned');
  if (!visible) return 'not-found';
  if (action === 'own') return role === 'clinician' ? 'allow' : 'forbidden';
  if (action === 'assign') return role === 'clinician' || role === 'admin' ? 'allow' : 'forbidden';
  return READERS[action].includes(role) ? 'allow' : 'forbidden';
}

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/** The one place that answers "may this actor do X with this client?" (every client route uses it). */
@Injectable()
export class ClientAccessService {
  constructor(
    @InjectRepository(Client) private readonly clients: Repository<Client>,
    @InjectRepository(ClientAssignment) private readonly assignments: Repository<ClientAssignment>,
    @InjectRepository(Consent) private readonly consents: Repository<Consent>,
  ) {}

  /** The client when `actor` may read `what` of it; 404 when out of sight, 403 when in sight but not allowed. */
  requireReadable(
    actor: AccessActor,
    clientId: string,
    what: ClientReadWhat,
    manager?: EntityManager,
  ): Promise<Client> {
    return this.require(actor, clientId, what, manager);
  }

  /** The client when `actor` is its owning clinician (every write to a client's records). */
  requireOwned(actor: AccessActor, clientId: string, manager?: EntityManager): Promise<Client> {
    return this.require(actor, clientId, 'own', manager);
  }

  /** The client when `actor` may change its carer assignments (owning clinician or admin). */
  requireAssignable(actor: AccessActor, clientId: string, manager?: EntityManager): Promise<Client> {
    return this.require(actor, clientId, 'assign', manager);
  }

  /** True when a training consent is in force today (not withdrawn or voided, givenOn ≤ today ≤ expiresOn). */
  async hasActiveTrainingConsent(clientId: string, manager?: EntityManager): Promise<boolean> {
    const repo = manager ? manager.getRepository(Consent) : this.consents;
    const today = todayIso();
    return repo
      .createQueryBuilder('consent')
      .where('consent.clientId = :clientId', { clientId })
      .andWhere('consent.withdrawnAt IS NULL')
      .andWhere('consent.voidedAt IS NULL')
      .andWhere(`'training' = ANY(consent.scopes)`)
      .andWhere('consent.givenOn <= :today', { today })
      .andWhere('(consent.expiresOn IS NULL OR consent.expiresOn >= :today)', { today })
      .getExists();
  }

  /** Throws 409 (NO_TRAINING_CONSENT_MESSAGE) unless a training consent is in force. */
  async requireTrainingConsent(clientId: string, manager?: EntityManager): Promise<void> {
    if (!(await this.hasActiveTrainingConsent(clientId, manager))) {
      throw new ConflictException(NO_TRAINING_CONSENT_MESSAGE);
    }
  }

  private async require(
    actor: AccessActor,
    clientId: string,
    action: ClientAction,
    manager?: EntityManager,
  ): Promise<Client> {
    if (!UUID.test(clientId)) throw new NotFoundException(CLIENT_NOT_FOUND_MESSAGE);
    const clients = manager ? manager.getRepository(Client) : this.clients;
    const client = await clients.findOneBy({ id: clientId });
    if (!client) throw new NotFoundException(CLIENT_NOT_FOUND_MESSAGE);
    const decision = decideClientAccess(actor.role, await this.relation(actor, client, manager), action);
    if (decision === 'not-found') throw new NotFoundException(CLIENT_NOT_FOUND_MESSAGE);
    if (decision === 'forbidden') throw new ForbiddenException(WRONG_ROLE_MESSAGE);
    return client;
  }

  private async relation(
    actor: AccessActor,
    client: Client,
    manager?: EntityManager,
  ): Promise<ClientRelation> {
    if (actor.role === 'clinician') return client.clinicianId === actor.id ? 'owner' : 'none';
    if (actor.role !== 'carer') return 'none';
    const assignments = manager ? manager.getRepository(ClientAssignment) : this.assignments;
    return (await assignments.existsBy({ clientId: client.id, userId: actor.id })) ? 'assigned' : 'none';
  }
}
