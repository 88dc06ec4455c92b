import { z } from 'zod';

// The four staff roles. Family contacts have no account (README, roles).
export const roles = ['admin', 'clinician', 'supervisor', 'carer'] as const;
export const roleSchema = z.enum(roles);
export type Role = z.infer<typeof roleSchema>;

// Human labels for each role, used by screens and e-mails alike.
export const roleLabels: Record<Role, string> = {
  admin: 'Administrator',
  clinician: 'Clinician',
  supervisor: 'Supervisor',
  carer: 'Carer',
};
