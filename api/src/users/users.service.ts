import { BadRequestException, ConflictException, Injectable, NotFoundException } from '@nestjs/common';
import { InjectDataSource, InjectRepository } from '@nestjs/typeorm';
import type { ChangePasswordInput, CreateUserInput, SessionUser, UpdateUserInput } from '@keyloom/shared';
import bcrypt from 'bcryptjs';
import { DataSource, type EntityManager, type Repository } from 'typeorm';
import { AuditService } from '../audit/audit.service';
import type { Actor } from '../auth/session-user';
import { AppConfig } from '../config/app-config';
import { isUniqueViolation } from '../database/database-errors';
import { toSessionUser, toUserDto, type UserDto } from './dto/user.dto';
import { PasswordStrength } from './password-strength';
import { User } from './user.entity';

export const DUPLICATE_EMAIL_MESSAGE = 'A staff account with that e-mail address already exists.';
export const NOT_FOUND_MESSAGE = 'There is no staff account with that id.';
export const SELF_DEACTIVATE_MESSAGE = 'You cannot deactivate your own account.';
export const SELF_DEMOTE_MESSAGE = 'You cannot remove your own administrator role.';
export const LAST_ADMIN_MESSAGE = 'The clinic must keep at least one active administrator.';
export const WRONG_CURRENT_PASSWORD_MESSAGE = 'Your current password is not right.';

type FieldChange = { from: unknown; to: unknown };

// The account's row of the sign-in limits (keyed by the lower-case e-mail, see auth/sign-in-limits).
async function clearSignInFailures(manager: EntityManager, email: string): Promise<void> {
  await manager.query(`DELETE FROM sign_in_limits WHERE kind = 'account' AND subject = lower($1)`, [email]);
}

@Injectable()
export class UsersService {
  constructor(
    @InjectRepository(User) private readonly users: Repository<User>,
    @InjectDataSource() private readonly dataSource: DataSource,
    private readonly audit: AuditService,
    private readonly config: AppConfig,
    private readonly strength: PasswordStrength,
  ) {}

  /** Every staff account, by name. */
  async findAll(): Promise<UserDto[]> {
    const rows = await this.users.find({ order: { name: 'ASC', email: 'ASC' } });
    return rows.map(toUserDto);
  }

  /** Creates an account with a bcrypt hash of the password; 409 when the e-mail is taken (any case). */
  async create(actor: Actor, input: CreateUserInput): Promise<UserDto> {
    this.strength.assertStrong(input.password, [input.email, input.name]);
    const passwordHash = await bcrypt.hash(input.password, this.config.bcryptCost);
    try {
      return await this.dataSource.transaction(async (manager) => {
        const repo = manager.getRepository(User);
        const inserted = await repo.insert({
          email: input.email,
          name: input.name,
          role: input.role,
          passwordHash,
          active: true,
        });
        const id = String(inserted.identifiers[0]?.id);
        const user = await repo.findOneByOrFail({ id });
        await this.audit.record(
          actor,
          'user.create',
          { type: 'user', id },
          { email: user.email, name: user.name, role: user.role },
          manager,
        );
        return toUserDto(user);
      });
    } catch (error) {
      if (isUniqueViolation(error)) throw new ConflictException(DUPLICATE_EMAIL_MESSAGE);
      throw error;
    }
  }

  /**
   * Changes name, role or active. An admin cannot deactivate or demote themselves, and the last
   * active admin cannot lose that status (409). Deactivating also ends the account's sessions.
   */
  async update(actor: Actor, id: string, input: UpdateUserInput): Promise<UserDto> {
    return this.dataSource.transaction(async (manager) => {
      const repo = manager.getRepository(User);
      const target = await repo.findOne({ where: { id }, lock: { mode: 'pessimistic_write' } });
      if (!target) throw new NotFoundException(NOT_FOUND_MESSAGE);

      const changes: Record<string, FieldChange> = {};
      for (const key of ['name', 'role', 'active'] as const) {
        const next = input[key];
        if (next !== undefined && next !== target[key]) changes[key] = { from: target[key], to: next };
      }
      if (input.password !== undefined)
        this.strength.assertStrong(input.password, [target.email, target.name]);
      const newPasswordHash =
        input.password === undefined ? undefined : await bcrypt.hash(input.password, this.config.bcryptCost);
      // The audit log says that a password was set, never what it was or its hash.
      if (newPasswordHash !== undefined) changes.password = { from: 'previous', to: 'new' };
      if (Object.keys(changes).length === 0) return toUserDto(target);

      const staysActiveAdmin = (input.role ?? target.role) === 'admin' && (input.active ?? target.active);
      if (actor.id === id && changes.active && input.active === false) {
        throw new ConflictException(SELF_DEACTIVATE_MESSAGE);
      }
      if (actor.id === id && changes.role && input.role !== 'admin') {
        throw new ConflictException(SELF_DEMOTE_MESSAGE);
      }
      if (target.role === 'admin' && target.active && !staysActiveAdmin) {
        // Lock the admin rows so two concurrent demotions cannot both pass this check.
        const admins = await repo.find({
          select: { id: true },
          where: { role: 'admin', active: true },
          lock: { mode: 'pessimistic_write' },
        });
        if (admins.filter((admin) => admin.id !== id).length === 0) {
          throw new ConflictException(LAST_ADMIN_MESSAGE);
        }
      }

      const patch: Partial<Pick<User, 'name' | 'role' | 'active' | 'passwordHash'>> = {};
      if (changes.name) patch.name = input.name;
      if (changes.role) patch.role = input.role;
      if (changes.active) patch.active = input.active;
      if (newPasswordHash !== undefined) patch.passwordHash = newPasswordHash;
      await repo.update({ id }, patch);
      // A new password also lifts a sign-in lock of the account (the only way out of the permanent one).
      if (newPasswordHash !== undefined) await clearSignInFailures(manager, target.email);
      if ((changes.active && input.active === false) || (newPasswordHash !== undefined && actor.id !== id)) {
        // Deactivation or a new password ends the account's sessions everywhere. The serializer
        // would refuse a deactivated user anyway; removing the rows also frees the store.
        await manager.query(`DELETE FROM "session" WHERE "sess"->'passport'->>'user' = $1`, [id]);
      }
      await this.audit.record(actor, 'user.update', { type: 'user', id }, { changes }, manager);
      return toUserDto(await repo.findOneByOrFail({ id }));
    });
  }

  /**
   * A signed-in user changes their own password: the current one must be right and the new one
   * strong. Clears "must change password", ends the account's other sessions (this one stays) and
   * lifts any sign-in lock of the account.
   */
  async changeOwnPassword(
    actor: Actor,
    input: ChangePasswordInput,
    keepSessionId: string,
  ): Promise<SessionUser> {
    const current = await this.users
      .createQueryBuilder('user')
      .addSelect('user.passwordHash')
      .where('user.id = :id', { id: actor.id })
      .getOne();
    if (!current) throw new NotFoundException(NOT_FOUND_MESSAGE);
    if (!(await bcrypt.compare(input.currentPassword, current.passwordHash))) {
      throw new BadRequestException({
        message: WRONG_CURRENT_PASSWORD_MESSAGE,
        issues: [{ path: 'currentPassword', message: WRONG_CURRENT_PASSWORD_MESSAGE }],
      });
    }
    this.strength.assertStrong(input.newPassword, [current.email, current.name], 'newPassword');
    const passwordHash = await bcrypt.hash(input.newPassword, this.config.bcryptCost);
    return this.dataSource.transaction(async (manager) => {
      const repo = manager.getRepository(User);
      await repo.update({ id: actor.id }, { passwordHash, mustChangePassword: false });
      await manager.query(`DELETE FROM "session" WHERE "sess"->'passport'->>'user' = $1 AND "sid" <> $2`, [
        actor.id,
        keepSessionId,
      ]);
      await clearSignInFailures(manager, current.email);
      await this.audit.record(actor, 'auth.password-change', { type: 'user', id: actor.id }, {}, manager);
      return toSessionUser(await repo.findOneByOrFail({ id: actor.id }));
    });
  }

  /** The account for a sign-in attempt, with its password hash; e-mail compared without case. */
  findForSignIn(email: string): Promise<User | null> {
    return this.users
      .createQueryBuilder('user')
      .addSelect('user.passwordHash')
      .where('lower(user.email) = lower(:email)', { email })
      .getOne();
  }

  /** The session user for an id, or null when the account is gone or deactivated. */
  async findActiveSessionUser(id: string): Promise<SessionUser | null> {
    const user = await this.users.findOneBy({ id, active: true });
    return user ? toSessionUser(user) : null;
  }

  async markSignedIn(id: string): Promise<void> {
    await this.users.update({ id }, { lastSignInAt: new Date() });
  }
}
