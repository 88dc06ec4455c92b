import { NavLink } from 'react-router-dom';
import type { NavItem } from '@/config/paths';
import { cn } from '@/lib/cn';

/** The header's page links; the current page is marked for sight and for screen readers. */
export const MainNav = ({ items }: { items: readonly NavItem[] }) => (
  <nav aria-label="Main">
    <ul className="flex flex-wrap gap-2">
      {items.map((item) => (
        <li key={item.to}>
          <NavLink
            to={item.to}
            className={({ isActive }) =>
              cn(
                'inline-flex min-h-11 items-center rounded-lg px-3 text-lg text-paper underline-offset-8',
                isActive ? 'font-bold underline decoration-saffron decoration-4' : 'hover:underline',
              )
            }
          >
            {item.label}
          </NavLink>
        </li>
      ))}
    </ul>
  </nav>
);
