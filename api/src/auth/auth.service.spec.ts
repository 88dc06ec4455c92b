import { Test } from '@nestjs/testing';
import bcrypt from 'bcryptjs';
import { AuditService } from '../audit/audit.service';
import { AppConfig } from '../config/app-config';
import { User } from '../users/user.entity';
import { UsersService } from '../users/users.service';
import { AuthService } from './auth.service';
import { SignInLimitsService } from './sign-in-limits/sign-in-limits.service';

const PASSWORD = 'a long passphrase';

describe(AuthService.name, () => {
  let sut: AuthService;
  let users: { findForSignIn: jest.Mock; markSignedIn: jest.Mock };
  let audit: { record: jest.Mock };
  let limits: { assertMayTry: jest.Mock; recordFailure: jest.Mock; recordSuccess: jest.Mock };
  let account: User;

  beforeAll(async () => {
    account = Object.assign(new User(), {
      id: '33333333-3333-4333-8333-333333333333',
      email: 'carer@willowmere.example',
      name: 'Hannah Ashby',
      role: 'carer',
      active: true,
      passwordHash: await bcrypt.hash(PASSWORD, 4),
    });
  });

  beforeEach(async () => {
    users = { findForSignIn: jest.fn(), markSignedIn: jest.fn() };
    audit = { record: jest.fn().mockResolvedValue(undefined) };
    limits = {
      assertMayTry: jest.fn().mockResolvedValue(undefined),
      recordFailure: jest.fn().mockResolvedValue(undefined),
      recordSuccess: jest.fn().mockResolvedValue(undefined),
    };
    const moduleRef = await Test.createTestingModule({
      providers: [
        AuthService,
        { provide: UsersService, useValue: users },
        { provide: AuditService, useValue: audit },
        { provide: AppConfig, useValue: { bcryptCost: 4 } },
        { provide: SignInLimitsService, useValue: limits },
      ],
    }).compile();
    sut = moduleRef.get(AuthService);
  });

  describe('validateUser()', () => {
    it('returns the session user for the right password', async () => {
      users.findForSignIn.mockResolvedValue(account);
      await expect(sut.validateUser(account.email, PASSWORD, '10.0.0.1')).resolves.toEqual({
        id: account.id,
        email: account.email,
        name: 'Hannah Ashby',
        role: 'carer',
      });
      expect(audit.record).not.toHaveBeenCalled();
      // A success clears the account's failures and is never counted as one.
      expect(limits.recordSuccess).toHaveBeenCalledWith(account.email);
      expect(limits.recordFailure).not.toHaveBeenCalled();
    });

    it('checks the sign-in limits before the password, and a held-back attempt goes no further', async () => {
      limits.assertMayTry.mockRejectedValue(new Error('held back'));
      await expect(sut.validateUser(account.email, PASSWORD, '10.0.0.1')).rejects.toThrow('held back');
      expect(limits.assertMayTry).toHaveBeenCalledWith(account.email, '10.0.0.1');
      expect(users.findForSignIn).not.toHaveBeenCalled();
    });

    it('returns null for a wrong password and audits the reason', async () => {
      users.findForSignIn.mockResolvedValue(account);
      await expect(sut.validateUser(account.email, 'wrong passphrase', '10.0.0.1')).resolves.toBeNull();
      expect(audit.record).toHaveBeenCalledWith(
        { id: null, email: account.email, ip: '10.0.0.1' },
        'auth.sign-in-failed',
        { type: 'user', id: account.id },
        { reason: 'wrong-password' },
      );
      expect(limits.recordFailure).toHaveBeenCalledWith(account.email, '10.0.0.1', account.id);
    });

    it('returns null for a deactivated account even with the right password', async () => {
      users.findForSignIn.mockResolvedValue(Object.assign(new User(), { ...account, active: false }));
      await expect(sut.validateUser(account.email, PASSWORD, null)).resolves.toBeNull();
      expect(audit.record.mock.calls[0][3]).toEqual({ reason: 'inactive-account' });
    });

    it('spends a bcrypt comparison on an unknown account (against a dummy hash of the same cost)', async () => {
      users.findForSignIn.mockResolvedValue(null);
      const compare = jest.spyOn(bcrypt, 'compare');
      await expect(sut.validateUser('nobody@willowmere.example', PASSWORD, null)).resolves.toBeNull();
      expect(compare).toHaveBeenCalledTimes(1);
      const dummyHash = compare.mock.calls[0][1];
      expect(dummyHash).toMatch(/^\$2[aby]\$04\$/);
      expect(audit.record.mock.calls[0][3]).toEqual({ reason: 'unknown-account' });
      // Counted like a real account's failure, under the typed address.
      expect(limits.recordFailure).toHaveBeenCalledWith('nobody@willowmere.example', null, null);
      compare.mockRestore();
    });
  });
});
