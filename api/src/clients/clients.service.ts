import { BadRequestException, ConflictException, Injectable, NotFoundException } from '@nestjs/common';
import { InjectDataSource, InjectRepository } from '@nestjs/typeorm';
import type { CreateAssignmentInput, CreateClientInput, PersonRef, UpdateClientInput } from '@keyloom/shared';
import { DataSource, type EntityManager, In, type Repository } from 'typeorm';
import { AuditService } from '../audit/audit.service';
import type { Actor } from '../auth/session-user';
import { Consent } from '../consents/consent.entity';
import { todayIso } from '../consents/consent-status';
import { User } from '../users/user.entity';
import { ClientAccessService } from './client-access.service';
import { ClientAssignment } from './client-assignment.entity';
import { Client } from './client.entity';
import {
  type Assignment,
  type CarerOption,
  type ClientDto,
  type ClientSummary,
  type SummaryContext,
  toClientDto,
  toClientSummary,
} from './dto/client.dto';

export const CHOOSE_ACTIVE_CARER_MESSAGE = 'Choose an active carer.';
export const ALREADY_ASSIGNED_MESSAGE = 'That carer is already assigned to this client.';
export const NOT_ASSIGNED_MESSAGE = 'That carer is not assigned to this client.';

const EDITABLE_FIELDS = [
  'pseudonym',
  'preferredName',
  'accessMethod',
  'scanIntervalMs',
  'dwellMs',
  'keyTimeMs',
  'goals',
  'notes',
] as const;

@Injectable()
export class ClientsService {
  constructor(
    @InjectRepository(Client) private readonly clients: Repository<Client>,
    @InjectDataSource() private readonly dataSource: DataSource,
    private readonly access: ClientAccessService,
    private readonly audit: AuditService,
  ) {}

  /**
   * The caseload the actor may see, by pseudonym: a clinician's own clients, a carer's assigned
   * clients, every client for supervisors and admins (admins use it to assign carers).
   */
  async findAll(actor: Actor): Promise<ClientSummary[]> {
    const query = this.clients.createQueryBuilder('client').orderBy('lower(client.pseudonym)', 'ASC');
    if (actor.role === 'clinician') query.where('client.clinicianId = :id', { id: actor.id });
    if (actor.role === 'carer') {
      query.innerJoin(ClientAssignment, 'mine', 'mine.clientId = client.id AND mine.userId = :id', {
        id: actor.id,
      });
    }
    const rows = await query.getMany();
    const contexts = await this.contexts(rows, this.dataSource.manager);
    return rows.map((client) => toClientSummary(client, contexts.get(client.id)!));
  }

  /** The client page; 404/403 from ClientAccessService ('clinical'). */
  async findOne(actor: Actor, id: string): Promise<ClientDto> {
    const client = await this.access.requireReadable(actor, id, 'clinical');
    return this.toDto(client, actor, this.dataSource.manager);
  }

  /** A new client in the actor's own caseload (clinicians only). */
  async create(actor: Actor, input: CreateClientInput): Promise<ClientDto> {
    return this.dataSource.transaction(async (manager) => {
      const repo = manager.getRepository(Client);
      const inserted = await repo.insert({
        pseudonym: input.pseudonym,
        preferredName: input.preferredName ?? null,
        accessMethod: input.accessMethod,
        scanIntervalMs: input.scanIntervalMs ?? null,
        dwellMs: input.dwellMs ?? null,
        keyTimeMs: input.keyTimeMs ?? null,
        goals: input.goals ?? null,
        notes: input.notes ?? null,
        clinicianId: actor.id,
      });
      const id = String(inserted.identifiers[0]?.id);
      const client = await repo.findOneByOrFail({ id });
      // Pseudonym and access method only: goals and notes are clinical text.
      await this.audit.record(
        actor,
        'client.create',
        { type: 'client', id, clientId: id },
        { pseudonym: client.pseudonym, accessMethod: client.accessMethod },
        manager,
      );
      return this.toDto(client, actor, manager);
    });
  }

  /** Changes the given fields (owning clinician); audits which fields changed, not their text. */
  async update(actor: Actor, id: string, input: UpdateClientInput): Promise<ClientDto> {
    return this.dataSource.transaction(async (manager) => {
      const client = await this.access.requireOwned(actor, id, manager);
      const patch: Partial<Pick<Client, (typeof EDITABLE_FIELDS)[number]>> = {};
      for (const key of EDITABLE_FIELDS) {
        const next = input[key];
        if (next !== undefined && next !== client[key]) Object.assign(patch, { [key]: next });
      }
      const fields = Object.keys(patch);
      if (fields.length === 0) return this.toDto(client, actor, manager);
      const repo = manager.getRepository(Client);
      await repo.update({ id }, patch);
      await this.audit.record(
        actor,
        'client.update',
        { type: 'client', id, clientId: id },
        { fields },
        manager,
      );
      return this.toDto(await repo.findOneByOrFail({ id }), actor, manager);
    });
  }

  /** The carers assigned to a client (anyone who sees the client). */
  async listAssignments(actor: Actor, id: string): Promise<Assignment[]> {
    await this.access.requireReadable(actor, id, 'client');
    return this.assignmentsOf(id, this.dataSource.manager);
  }

  /** Assigns an active carer (owning clinician or admin); 400 for anyone else, 409 when already assigned. */
  async assign(actor: Actor, id: string, input: CreateAssignmentInput): Promise<Assignment> {
    return this.dataSource.transaction(async (manager) => {
      await this.access.requireAssignable(actor, id, manager);
      const carer = await manager.getRepository(User).findOneBy({ id: input.userId });
      if (!carer || carer.role !== 'carer' || !carer.active) {
        throw new BadRequestException({
          message: CHOOSE_ACTIVE_CARER_MESSAGE,
          issues: [{ path: 'userId', message: CHOOSE_ACTIVE_CARER_MESSAGE }],
        });
      }
      const repo = manager.getRepository(ClientAssignment);
      if (await repo.existsBy({ clientId: id, userId: carer.id })) {
        throw new ConflictException(ALREADY_ASSIGNED_MESSAGE);
      }
      await repo.insert({ clientId: id, userId: carer.id, assignedById: actor.id });
      await this.audit.record(
        actor,
        'assignment.create',
        { type: 'client_assignment', id: carer.id, clientId: id },
        { carerId: carer.id },
        manager,
      );
      const assignments = await this.assignmentsOf(id, manager);
      return assignments.find((assignment) => assignment.userId === carer.id)!;
    });
  }

  /** Removes a carer's assignment (owning clinician or admin); 404 when not assigned. */
  async unassign(actor: Actor, id: string, userId: string): Promise<void> {
    await this.dataSource.transaction(async (manager) => {
      await this.access.requireAssignable(actor, id, manager);
      const result = await manager.getRepository(ClientAssignment).delete({ clientId: id, userId });
      if (!result.affected) throw new NotFoundException(NOT_ASSIGNED_MESSAGE);
      await this.audit.record(
        actor,
        'assignment.delete',
        { type: 'client_assignment', id: userId, clientId: id },
        { carerId: userId },
        manager,
      );
    });
  }

  /** Active carers not yet assigned to the client, by name (for the assignment picker). */
  async carersAvailable(actor: Actor, id: string): Promise<CarerOption[]> {
    await this.access.requireAssignable(actor, id);
    const rows = await this.dataSource
      .getRepository(User)
      .createQueryBuilder('user')
      .where(`user.role = 'carer' AND user.active`)
      .andWhere(
        'NOT EXISTS (SELECT 1 FROM client_assignments a WHERE a.client_id = :id AND a.user_id = user.id)',
        { id },
      )
      .orderBy('user.name', 'ASC')
      .getMany();
    return rows.map((user) => ({ id: user.id, name: user.name, email: user.email }));
  }

  private async toDto(client: Client, actor: Actor, manager: EntityManager): Promise<ClientDto> {
    const contexts = await this.contexts([client], manager);
    return toClientDto(client, contexts.get(client.id)!, actor.role !== 'carer');
  }

  private async assignmentsOf(clientId: string, manager: EntityManager): Promise<Assignment[]> {
    const rows = await manager
      .getRepository(ClientAssignment)
      .createQueryBuilder('a')
      .innerJoinAndSelect('a.user', 'carer')
      .leftJoinAndSelect('a.assignedBy', 'by')
      .where('a.clientId = :clientId', { clientId })
      .orderBy('carer.name', 'ASC')
      .getMany();
    return rows.map((row) => ({
      userId: row.userId,
      name: row.user?.name ?? '',
      email: row.user?.email ?? '',
      assignedAt: row.assignedAt.toISOString(),
      assignedBy: row.assignedBy?.name ?? 'a former staff member',
    }));
  }

  /** Clinician, carers, consents and sample counts for many clients in four queries. */
  private async contexts(clients: Client[], manager: EntityManager): Promise<Map<string, SummaryContext>> {
    const ids = clients.map((client) => client.id);
    const result = new Map<string, SummaryContext>();
    if (ids.length === 0) return result;
    const today = todayIso();
    const clinicianIds = [...new Set(clients.map((client) => client.clinicianId))];
    // One after another: inside a transaction all four share one connection.
    const clinicians = await manager.getRepository(User).findBy({ id: In(clinicianIds) });
    const assignments = await manager
      .getRepository(ClientAssignment)
      .createQueryBuilder('a')
      .innerJoinAndSelect('a.user', 'carer')
      .where('a.clientId IN (:...ids)', { ids })
      .orderBy('carer.name', 'ASC')
      .getMany();
    const consents = await manager
      .getRepository(Consent)
      .find({ where: { clientId: In(ids) }, order: { createdAt: 'DESC', id: 'ASC' } });
    const samples = await this.sampleCounts(ids, manager);
    const names = new Map(clinicians.map((user) => [user.id, user.name]));
    for (const client of clients) {
      const carers: PersonRef[] = assignments
        .filter((row) => row.clientId === client.id)
        .map((row) => ({ id: row.userId, name: row.user?.name ?? '' }));
      result.set(client.id, {
        clinician: { id: client.clinicianId, name: names.get(client.clinicianId) ?? '' },
        carers,
        consents: consents.filter((consent) => consent.clientId === client.id),
        sampleCount: samples.get(client.id) ?? 0,
        today,
      });
    }
    return result;
  }

  // Samples are G2's table; counted only once its migration has created it (not excluded ones).
  private async sampleCounts(ids: string[], manager: EntityManager): Promise<Map<string, number>> {
    const [probe] = await manager.query<{ present: boolean }[]>(
      `SELECT to_regclass('language_samples') IS NOT NULL AS present`,
    );
    if (!probe?.present) return new Map();
    const rows = await manager.query<{ client_id: string; n: number }[]>(
      `SELECT client_id, count(*)::int AS n FROM language_samples
        WHERE client_id = ANY($1::uuid[]) AND status <> 'excluded' GROUP BY client_id`,
      [ids],
    );
    return new Map(rows.map((row) => [row.client_id, row.n]));
  }
}
