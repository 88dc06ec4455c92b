import { ConflictException, ForbiddenException, NotFoundException } from '@nestjs/common';
import { Test } from '@nestjs/testing';
import { getRepositoryToken } from '@nestjs/typeorm';
import type { Role } from '@keyloom/shared';
import { Consent } from '../consents/consent.entity';
import {
  type AccessDecision,
  type ClientAction,
  ClientAccessService,
  CLIENT_NOT_FOUND_MESSAGE,
  type ClientRelation,
  decideClientAccess,
  NO_TRAINING_CONSENT_MESSAGE,
} from './client-access.service';
import { ClientAssignment } from './client-assignment.entity';
import { Client } from './client.entity';

const OWNER = '11111111-1111-4111-8111-111111111111';
const OTHER = '22222222-2222-4222-8222-222222222222';
const CLIENT_ID = '33333333-3333-4333-8333-333333333333';

// The "who may do what", written out cell by cell (allow / forbidden 403 / not-found 404).
const A = 'allow';
const F = 'forbidden';
const N = 'not-found';
const actions: ClientAction[] = ['client', 'clinical', 'samples', 'consents', 'contacts', 'own', 'assign'];
const matrix: Array<[Role, ClientRelation, AccessDecision[]]> = [
  //                              client clinical samples consents contacts own assign
  ['clinician', 'owner', /*    */ [A, A, A, A, A, A, A]],
  ['clinician', 'none', /*     */ [N, N, N, N, N, N, N]],
  ['supervisor', 'none', /*    */ [A, A, A, A, A, F, F]],
  ['carer', 'assigned', /*     */ [A, A, F, F, F, F, F]],
  ['carer', 'none', /*         */ [N, N, N, N, N, N, N]],
  ['admin', 'none', /*         */ [A, F, F, F, F, F, A]],
];

describe('decideClientAccess', () => {
  it.each(matrix)('%s (%s)', (role, relation, expected) => {
    expect(actions.map((action) => decideClientAccess(role, relation, action))).toEqual(expected);
  });

  it('does not let a clinician reach another’s client through an assignment row', () => {
    // Only carers are assigned; a stray "assigned" relation must not open a foreign caseload.
    expect(decideClientAccess('clinician', 'assigned', 'client')).toBe('not-found');
  });
});

describe(ClientAccessService.name, () => {
  let sut: ClientAccessService;
  let clients: { findOneBy: jest.Mock };
  let assignments: { existsBy: jest.Mock };
  let consentQuery: { where: jest.Mock; andWhere: jest.Mock; getExists: jest.Mock };

  beforeEach(async () => {
    clients = { findOneBy: jest.fn() };
    assignments = { existsBy: jest.fn().mockResolvedValue(false) };
    consentQuery = { where: jest.fn(), andWhere: jest.fn(), getExists: jest.fn() };
    consentQuery.where.mockReturnValue(consentQuery);
    consentQuery.andWhere.mockReturnValue(consentQuery);
    const moduleRef = await Test.createTestingModule({
      providers: [
        ClientAccessService,
        { provide: getRepositoryToken(Client), useValue: clients },
        { provide: getRepositoryToken(ClientAssignment), useValue: assignments },
        { provide: getRepositoryToken(Consent), useValue: { createQueryBuilder: () => consentQuery } },
      ],
    }).compile();
    sut = moduleRef.get(ClientAccessService);
  });

  const owned = () => Object.assign(new Client(), { id: CLIENT_ID, clinicianId: OWNER });

  it('gives the owner the client, and another clinician the made-up-id answer', async () => {
    clients.findOneBy.mockResolvedValue(owned());
    await expect(sut.requireOwned({ id: OWNER, role: 'clinician' }, CLIENT_ID)).resolves.toMatchObject({
      id: CLIENT_ID,
    });
    const other = sut.requireReadable({ id: OTHER, role: 'clinician' }, CLIENT_ID, 'client');
    await expect(other).rejects.toThrow(new NotFoundException(CLIENT_NOT_FOUND_MESSAGE));
    clients.findOneBy.mockResolvedValue(null);
    await expect(sut.requireReadable({ id: OWNER, role: 'clinician' }, CLIENT_ID, 'client')).rejects.toThrow(
      new NotFoundException(CLIENT_NOT_FOUND_MESSAGE),
    );
  });

  it('answers 404 for an id that is not a uuid without asking the database', async () => {
    await expect(sut.requireReadable({ id: OWNER, role: 'supervisor' }, 'nope', 'client')).rejects.toThrow(
      NotFoundException,
    );
    expect(clients.findOneBy).not.toHaveBeenCalled();
  });

  it('asks for the assignment of a carer: 404 unassigned, 403 for samples when assigned', async () => {
    clients.findOneBy.mockResolvedValue(owned());
    const carer = { id: OTHER, role: 'carer' as const };
    await expect(sut.requireReadable(carer, CLIENT_ID, 'client')).rejects.toThrow(NotFoundException);
    expect(assignments.existsBy).toHaveBeenCalledWith({ clientId: CLIENT_ID, userId: OTHER });
    assignments.existsBy.mockResolvedValue(true);
    await expect(sut.requireReadable(carer, CLIENT_ID, 'clinical')).resolves.toBeInstanceOf(Client);
    await expect(sut.requireReadable(carer, CLIENT_ID, 'samples')).rejects.toThrow(ForbiddenException);
  });

  it('lets an admin assign but not read consents, and a supervisor read but not assign', async () => {
    clients.findOneBy.mockResolvedValue(owned());
    await expect(sut.requireAssignable({ id: OTHER, role: 'admin' }, CLIENT_ID)).resolves.toBeInstanceOf(
      Client,
    );
    await expect(sut.requireReadable({ id: OTHER, role: 'admin' }, CLIENT_ID, 'consents')).rejects.toThrow(
      ForbiddenException,
    );
    await expect(
      sut.requireReadable({ id: OTHER, role: 'supervisor' }, CLIENT_ID, 'samples'),
    ).resolves.toBeInstanceOf(Client);
    await expect(sut.requireAssignable({ id: OTHER, role: 'supervisor' }, CLIENT_ID)).rejects.toThrow(
      ForbiddenException,
    );
  });

  it('refuses with 409 and the contract’s message when no training consent is in force', async () => {
    consentQuery.getExists.mockResolvedValue(false);
    await expect(sut.requireTrainingConsent(CLIENT_ID)).rejects.toThrow(
      new ConflictException(NO_TRAINING_CONSENT_MESSAGE),
    );
    consentQuery.getExists.mockResolvedValue(true);
    await expect(sut.requireTrainingConsent(CLIENT_ID)).resolves.toBeUndefined();
    const conditions = consentQuery.andWhere.mock.calls.map((call) => String(call[0])).join(' ');
    expect(conditions).toContain('withdrawnAt IS NULL');
    expect(conditions).toContain(`'training' = ANY`);
    expect(conditions).toContain('givenOn <= :today');
    expect(conditions).toContain('expiresOn >= :today');
  });
});
