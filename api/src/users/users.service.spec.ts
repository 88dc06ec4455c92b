import { ConflictException, NotFoundException } from '@nestjs/common';
import { Test } from '@nestjs/testing';
import { getDataSourceToken, getRepositoryToken } from '@nestjs/typeorm';
import type { Role } from '@keyloom/shared';
import bcrypt from 'bcryptjs';
import { AuditService } from '../audit/audit.service';
import type { Actor } from '../auth/session-user';
import { AppConfig } from '../config/app-config';
import { User } from './user.entity';
import { PasswordStrength } from './password-strength';
import {
  DUPLICATE_EMAIL_MESSAGE,
  LAST_ADMIN_MESSAGE,
  SELF_DEACTIVATE_MESSAGE,
  SELF_DEMOTE_MESSAGE,
  UsersService,
} from './users.service';

const ADMIN_ID = '11111111-1111-4111-8111-111111111111';
const OTHER_ID = '22222222-2222-4222-8222-222222222222';

function aUser({
  id = OTHER_ID,
  email = 'someone@willowmere.example',
  name = 'Some One',
  role = 'clinician',
  active = true,
}: { id?: string; email?: string; name?: string; role?: Role; active?: boolean } = {}): User {
  return Object.assign(new User(), {
    id,
    email,
    name,
    role,
    active,
    passwordHash: 'not-selected',
    createdAt: new Date('2026-01-02T03:04:05Z'),
    updatedAt: new Date('2026-01-02T03:04:05Z'),
    lastSignInAt: null,
  });
}

const admin: Actor = {
  id: ADMIN_ID,
  email: 'admin@willowmere.example',
  name: 'Ada',
  role: 'admin',
  ip: '127.0.0.1',
};

describe(UsersService.name, () => {
  let sut: UsersService;
  let repo: {
    insert: jest.Mock;
    findOne: jest.Mock;
    findOneByOrFail: jest.Mock;
    find: jest.Mock;
    update: jest.Mock;
  };
  let manager: { getRepository: jest.Mock; query: jest.Mock };
  let audit: { record: jest.Mock };

  beforeEach(async () => {
    repo = {
      insert: jest.fn(),
      findOne: jest.fn(),
      findOneByOrFail: jest.fn(),
      find: jest.fn(),
      update: jest.fn().mockResolvedValue({ affected: 1 }),
    };
    manager = { getRepository: jest.fn().mockReturnValue(repo), query: jest.fn().mockResolvedValue([]) };
    audit = { record: jest.fn().mockResolvedValue(undefined) };
    const dataSource = { transaction: jest.fn((work: (m: typeof manager) => unknown) => work(manager)) };
    const moduleRef = await Test.createTestingModule({
      providers: [
        UsersService,
        { provide: getRepositoryToken(User), useValue: repo },
        { provide: getDataSourceToken(), useValue: dataSource },
        { provide: AuditService, useValue: audit },
        { provide: AppConfig, useValue: { bcryptCost: 4 } },
        PasswordStrength,
      ],
    }).compile();
    sut = moduleRef.get(UsersService);
  });

  describe('create()', () => {
    const input = {
      email: 'new@willowmere.example',
      name: 'New Person',
      role: 'carer' as const,
      password: 'a long passphrase',
    };

    it('stores a bcrypt hash of the password, never the password, and audits without it', async () => {
      repo.insert.mockResolvedValue({ identifiers: [{ id: OTHER_ID }] });
      repo.findOneByOrFail.mockResolvedValue(aUser({ email: input.email, name: input.name, role: 'carer' }));

      const created = await sut.create(admin, input);

      const stored = repo.insert.mock.calls[0][0] as { passwordHash: string };
      expect(stored.passwordHash).not.toBe(input.password);
      expect(stored.passwordHash).toMatch(/^\$2[aby]\$04\$/); // bcrypt, cost from config
      await expect(bcrypt.compare(input.password, stored.passwordHash)).resolves.toBe(true);
      expect(created).toEqual(expect.objectContaining({ id: OTHER_ID, email: input.email, role: 'carer' }));
      expect(created).not.toHaveProperty('passwordHash');
      expect(audit.record).toHaveBeenCalledWith(
        admin,
        'user.create',
        { type: 'user', id: OTHER_ID },
        { email: input.email, name: input.name, role: 'carer' },
        manager,
      );
      expect(JSON.stringify(audit.record.mock.calls)).not.toContain(stored.passwordHash);
    });

    it('answers 409 when the e-mail is already taken (unique violation)', async () => {
      repo.insert.mockRejectedValue(Object.assign(new Error('duplicate key'), { code: '23505' }));
      await expect(sut.create(admin, input)).rejects.toThrow(new ConflictException(DUPLICATE_EMAIL_MESSAGE));
      expect(audit.record).not.toHaveBeenCalled();
    });
  });

  describe('update()', () => {
    it('answers 404 for an unknown id', async () => {
      repo.findOne.mockResolvedValue(null);
      await expect(sut.update(admin, OTHER_ID, { role: 'carer' })).rejects.toThrow(NotFoundException);
    });

    it('refuses to let an admin deactivate themselves', async () => {
      repo.findOne.mockResolvedValue(aUser({ id: ADMIN_ID, role: 'admin' }));
      repo.find.mockResolvedValue([{ id: ADMIN_ID }, { id: OTHER_ID }]);
      await expect(sut.update(admin, ADMIN_ID, { active: false })).rejects.toThrow(
        new ConflictException(SELF_DEACTIVATE_MESSAGE),
      );
      expect(repo.update).not.toHaveBeenCalled();
    });

    it('refuses to let an admin remove their own admin role', async () => {
      repo.findOne.mockResolvedValue(aUser({ id: ADMIN_ID, role: 'admin' }));
      await expect(sut.update(admin, ADMIN_ID, { role: 'supervisor' })).rejects.toThrow(SELF_DEMOTE_MESSAGE);
      expect(repo.update).not.toHaveBeenCalled();
    });

    it('keeps the last active admin (another admin would be demoted to nothing)', async () => {
      // The actor is a second admin account whose row is inactive; OTHER_ID is the only active admin.
      repo.findOne.mockResolvedValue(aUser({ id: OTHER_ID, role: 'admin' }));
      repo.find.mockResolvedValue([{ id: OTHER_ID }]);
      await expect(sut.update(admin, OTHER_ID, { active: false })).rejects.toThrow(LAST_ADMIN_MESSAGE);
      await expect(sut.update(admin, OTHER_ID, { role: 'carer' })).rejects.toThrow(LAST_ADMIN_MESSAGE);
      expect(repo.update).not.toHaveBeenCalled();
    });

    it('demotes an admin when another active admin remains, and audits what changed', async () => {
      repo.findOne.mockResolvedValue(aUser({ id: OTHER_ID, role: 'admin', name: 'Old Name' }));
      repo.find.mockResolvedValue([{ id: OTHER_ID }, { id: ADMIN_ID }]);
      repo.findOneByOrFail.mockResolvedValue(aUser({ id: OTHER_ID, role: 'clinician', name: 'Old Name' }));

      const updated = await sut.update(admin, OTHER_ID, { role: 'clinician', name: 'Old Name' });

      expect(updated.role).toBe('clinician');
      expect(repo.update).toHaveBeenCalledWith({ id: OTHER_ID }, { role: 'clinician' });
      expect(audit.record).toHaveBeenCalledWith(
        admin,
        'user.update',
        { type: 'user', id: OTHER_ID },
        { changes: { role: { from: 'admin', to: 'clinician' } } },
        manager,
      );
    });

    it('ends the sessions of a deactivated account', async () => {
      repo.findOne.mockResolvedValue(aUser({ id: OTHER_ID, role: 'carer' }));
      repo.findOneByOrFail.mockResolvedValue(aUser({ id: OTHER_ID, role: 'carer', active: false }));
      await sut.update(admin, OTHER_ID, { active: false });
      expect(repo.find).not.toHaveBeenCalled(); // not an admin: no last-admin check needed
      expect(manager.query).toHaveBeenCalledWith(expect.stringContaining('DELETE FROM "session"'), [
        OTHER_ID,
      ]);
    });

    it('sets a new password as a bcrypt hash, ends the sessions, and audits only that it happened', async () => {
      repo.findOne.mockResolvedValue(aUser({ id: OTHER_ID, role: 'carer' }));
      repo.findOneByOrFail.mockResolvedValue(aUser({ id: OTHER_ID, role: 'carer' }));
      const password = 'a brand new passphrase';

      await sut.update(admin, OTHER_ID, { password });

      const patch = repo.update.mock.calls[0][1] as { passwordHash: string };
      await expect(bcrypt.compare(password, patch.passwordHash)).resolves.toBe(true);
      expect(manager.query).toHaveBeenCalledWith(expect.stringContaining('DELETE FROM "session"'), [
        OTHER_ID,
      ]);
      const audited = JSON.stringify(audit.record.mock.calls);
      expect(audited).toContain('"password"');
      expect(audited).not.toContain(password);
      expect(audited).not.toContain(patch.passwordHash);
    });

    it('changes nothing and records nothing when the values are already set', async () => {
      repo.findOne.mockResolvedValue(aUser({ id: OTHER_ID, role: 'carer' }));
      await sut.update(admin, OTHER_ID, { role: 'carer', active: true });
      expect(repo.update).not.toHaveBeenCalled();
      expect(audit.record).not.toHaveBeenCalled();
    });
  });
});
