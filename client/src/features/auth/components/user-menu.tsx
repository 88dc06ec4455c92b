import { Menu, MenuButton, MenuItem, MenuItems, MenuSeparator } from '@headlessui/react';
import { roleLabels, type SessionUser } from '@keyloom/shared';
import { Link } from 'react-router-dom';
import { paths } from '@/config/paths';
import { useLogout } from '../api/logout';

const initialsOf = (name: string): string =>
  name
    .split(/\s+/)
    .filter((part) => /^\p{L}/u.test(part))
    .slice(0, 2)
    .map((part) => part[0]?.toUpperCase())
    .join('');

/** The signed-in person's name and role, with "Change password" and "Sign out". */
export const UserMenu = ({ user }: { user: SessionUser }) => {
  const logout = useLogout();
  return (
    <Menu>
      <MenuButton className="inline-flex min-h-11 items-center gap-3 rounded-lg border-2 border-paper/40 px-3 py-1 text-left text-paper hover:border-saffron data-open:border-saffron">
        <span
          aria-hidden="true"
          className="grid size-8 place-items-center rounded-full bg-paper font-bold text-ink"
        >
          {initialsOf(user.name)}
        </span>
        <span className="flex flex-col leading-tight">
          <span className="font-bold">{user.name}</span>
          <span className="text-sm">{roleLabels[user.role]}</span>
        </span>
        <svg aria-hidden="true" viewBox="0 0 20 20" className="size-4 fill-current">
          <path d="M5 7h10l-5 6-5-6Z" />
        </svg>
      </MenuButton>
      <MenuItems
        anchor={{ to: 'bottom end', gap: 8 }}
        className="z-40 min-w-64 rounded-xl border-2 border-ink bg-surface p-2 text-ink shadow-lg"
      >
        <div className="px-3 py-2">
          <p className="font-bold">{user.name}</p>
          <p className="text-ink-soft">{user.email}</p>
          <p className="text-ink-soft">{roleLabels[user.role]}</p>
        </div>
        <MenuSeparator className="my-1 h-0.5 bg-thread" />
        <MenuItem>
          <Link
            to={paths.account}
            className="flex min-h-11 w-full items-center rounded-lg px-3 text-left font-bold data-focus:bg-ink data-focus:text-paper data-focus:underline"
          >
            Change password
          </Link>
        </MenuItem>
        <MenuItem>
          <button
            type="button"
            onClick={() => logout.mutate()}
            disabled={logout.isPending}
            className="flex min-h-11 w-full items-center rounded-lg px-3 text-left font-bold data-focus:bg-ink data-focus:text-paper data-focus:underline"
          >
            {logout.isPending ? 'Signing out…' : 'Sign out'}
          </button>
        </MenuItem>
      </MenuItems>
    </Menu>
  );
};
