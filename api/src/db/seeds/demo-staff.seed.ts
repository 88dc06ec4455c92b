import type { Role } from '@keyloom/shared';
import bcrypt from 'bcryptjs';
import { AuditEvent } from '../../audit/audit-event.entity';
import { User } from '../../users/user.entity';
import type { SeedStep } from './seed-step';

// The demo clinic's staff (foundation contract; invented for the Willowmere demo scenario).
export const DEMO_STAFF: ReadonlyArray<{ email: string; name: string; role: Role }> = [
  { email: 'admin@willowmere.example', name: 'Imogen Hale', role: 'admin' },
  { email: 'clinician@willowmere.example', name: 'Dr. Tomasz Reyes', role: 'clinician' },
  { email: 'supervisor@willowmere.example', name: 'Priya Okonkwo', role: 'supervisor' },
  { email: 'carer@willowmere.example', name: 'Hannah Ashby', role: 'carer' },
];

export const demoStaffStep: SeedStep = {
  name: 'demo staff accounts',
  async run({ manager, env, resetPasswords, log }) {
    const users = manager.getRepository(User);
    const audit = manager.getRepository(AuditEvent);
    const hash = () => bcrypt.hash(env.DEMO_PASSWORD, env.BCRYPT_COST);
    // Outside demo mode the shared demo password is only a first key: each account must choose its own.
    const mustChangePassword = !env.DEMO_MODE;
    for (const staff of DEMO_STAFF) {
      const existing = await users
        .createQueryBuilder('user')
        .where('lower(user.email) = lower(:email)', { email: staff.email })
        .getOne();
      if (!existing) {
        const inserted = await users.insert({
          ...staff,
          passwordHash: await hash(),
          active: true,
          mustChangePassword,
        });
        const id = String(inserted.identifiers[0]?.id);
        await audit.insert({
          action: 'user.create',
          subjectType: 'user',
          subjectId: id,
          details: { ...staff, by: 'seed' },
        });
        log(
          `created ${staff.email} (${staff.role})${mustChangePassword ? ', password to be changed at sign-in' : ''}`,
        );
      } else if (resetPasswords) {
        await users.update({ id: existing.id }, { passwordHash: await hash(), mustChangePassword });
        log(`reset the password of ${staff.email}${mustChangePassword ? ' (to be changed at sign-in)' : ''}`);
      } else {
        log(`kept ${staff.email}`);
      }
    }
  },
};
