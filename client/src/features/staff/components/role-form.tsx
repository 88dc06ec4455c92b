import { type Role, roleLabels, roles, type User } from '@keyloom/shared';
import { type FormEvent, useState } from 'react';
import { Button } from '@/components/ui/button';
import { fieldClasses } from '@/components/ui/field-classes';
import { useUpdateUser } from '../api/update-user';

type RoleFormProps = {
  user: User;
  /** Why the controls are off (e.g. it is the admin's own account); null when they are on. */
  lockedReasonId: string | null;
  onSaved: (user: User) => void;
  onFailed: (message: string) => void;
};

/** A labelled role select with its own Save button, one per staff row. */
export const RoleForm = ({ user, lockedReasonId, onSaved, onFailed }: RoleFormProps) => {
  // Stable across the row's re-render with the new role (the form is keyed by role), so focus can
  // come back to it after a save: the Save button turns off then, which would drop focus to the page.
  const selectId = `role-${user.id}`;
  const [role, setRole] = useState<Role>(user.role);
  const updateUser = useUpdateUser();
  const locked = lockedReasonId !== null;
  const changed = role !== user.role;

  const save = async (event: FormEvent) => {
    event.preventDefault();
    if (!changed) return;
    try {
      onSaved(await updateUser.mutateAsync({ id: user.id, changes: { role } }));
    } catch (error) {
      setRole(user.role);
      onFailed(error instanceof Error ? error.message : 'The role was not changed. Try again.');
    }
    setTimeout(() => document.getElementById(selectId)?.focus(), 0);
  };

  return (
    <form onSubmit={(event) => void save(event)} className="flex flex-wrap items-center gap-2 md:flex-nowrap">
      <label htmlFor={selectId} className="sr-only">
        Role for {user.name}
      </label>
      <select
        id={selectId}
        value={role}
        onChange={(event) => setRole(event.target.value as Role)}
        disabled={locked || updateUser.isPending}
        aria-describedby={lockedReasonId ?? undefined}
        className={`${fieldClasses(false)} w-auto min-w-40`}
      >
        {roles.map((value) => (
          <option key={value} value={value}>
            {roleLabels[value]}
          </option>
        ))}
      </select>
      <Button
        type="submit"
        disabled={locked || !changed || updateUser.isPending}
        aria-describedby={lockedReasonId ?? undefined}
        aria-label={`Save role for ${user.name}`}
      >
        Save
      </Button>
    </form>
  );
};
