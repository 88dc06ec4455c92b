import type { User } from '@keyloom/shared';
import { useId } from 'react';
import { Button } from '@/components/ui/button';
import {
  ColumnHeader,
  RowHeader,
  Table,
  TableBody,
  TableCell,
  TableHead,
  TableRow,
} from '@/components/ui/table';
import { formatDateTime } from '@/lib/format';
import { cn } from '@/lib/cn';
import { RoleForm } from './role-form';

type StaffTableProps = {
  users: readonly User[];
  /** The signed-in admin: their own role and status controls are switched off. */
  currentUserId: string;
  onRoleSaved: (user: User) => void;
  onActionFailed: (message: string) => void;
  onToggleActive: (user: User) => void;
  onSetPassword: (user: User) => void;
};

const StatusBadge = ({ active }: { active: boolean }) => (
  <span
    className={cn(
      'inline-flex w-fit items-center gap-2 rounded-full border-2 px-3 py-0.5 font-bold',
      active
        ? 'border-success bg-success-light text-success'
        : 'border-field-border bg-paper-deep text-ink-soft',
    )}
  >
    <span aria-hidden="true" className={cn('size-2.5 rounded-full', active ? 'bg-success' : 'bg-ink-soft')} />
    {active ? 'Active' : 'Deactivated'}
  </span>
);

// Long addresses may wrap after the "@", never in the middle of a word.
const EmailAddress = ({ email }: { email: string }) => {
  const at = email.indexOf('@');
  if (at < 0) return <>{email}</>;
  return (
    <>
      {email.slice(0, at)}
      <wbr />@{email.slice(at + 1)}
    </>
  );
};

const StaffRow = ({
  user,
  isSelf,
  onRoleSaved,
  onActionFailed,
  onToggleActive,
  onSetPassword,
}: Omit<StaffTableProps, 'users' | 'currentUserId'> & { user: User; isSelf: boolean }) => {
  const reasonId = useId();
  return (
    <TableRow className={cn(!user.active && 'text-ink-soft')}>
      <RowHeader label="Name">
        <span>
          {user.name}
          {isSelf && <span className="font-normal"> (you)</span>}
        </span>
      </RowHeader>
      <TableCell label="E-mail">
        <span>
          <EmailAddress email={user.email} />
        </span>
      </TableCell>
      <TableCell label="Role">
        <RoleForm
          key={user.role}
          user={user}
          lockedReasonId={isSelf ? reasonId : null}
          onSaved={onRoleSaved}
          onFailed={onActionFailed}
        />
      </TableCell>
      <TableCell label="Status">
        <StatusBadge active={user.active} />
      </TableCell>
      <TableCell label="Last sign-in">
        {user.lastSignInAt ? (
          <time dateTime={user.lastSignInAt} className="md:whitespace-nowrap">
            {formatDateTime(user.lastSignInAt)}
          </time>
        ) : (
          'Never'
        )}
      </TableCell>
      <TableCell label="Account">
        <Button
          variant={user.active ? 'secondary' : 'primary'}
          disabled={isSelf}
          aria-describedby={isSelf ? reasonId : undefined}
          onClick={() => onToggleActive(user)}
          // The visible word starts the name, so voice control users can say what they see.
          aria-label={`${user.active ? 'Deactivate' : 'Reactivate'} ${user.name}`}
          className="self-start"
        >
          {user.active ? 'Deactivate' : 'Reactivate'}
        </Button>
        <Button
          onClick={() => onSetPassword(user)}
          aria-label={`Set password for ${user.name}`}
          className="mt-2 self-start"
        >
          Set password
        </Button>
        {isSelf && (
          <p id={reasonId} className="mt-2 max-w-56 text-sm text-ink-soft">
            This is your own account: another administrator can change its role or deactivate it.
          </p>
        )}
      </TableCell>
    </TableRow>
  );
};

/** Every staff account with its role and status controls; rows become cards on narrow screens. */
export const StaffTable = ({ users, currentUserId, ...handlers }: StaffTableProps) => {
  const sorted = [...users].sort((a, b) => a.name.localeCompare(b.name, 'en'));
  return (
    <Table caption={`Staff accounts (${users.length})`}>
      <TableHead>
        <ColumnHeader>Name</ColumnHeader>
        <ColumnHeader>E-mail</ColumnHeader>
        <ColumnHeader>Role</ColumnHeader>
        <ColumnHeader>Status</ColumnHeader>
        <ColumnHeader>Last sign-in</ColumnHeader>
        <ColumnHeader>Account</ColumnHeader>
      </TableHead>
      <TableBody>
        {sorted.map((user) => (
          <StaffRow key={user.id} user={user} isSelf={user.id === currentUserId} {...handlers} />
        ))}
      </TableBody>
    </Table>
  );
};
