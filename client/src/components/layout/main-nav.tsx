import { Link, useLocation } from 'react-router-dom';
import type { NavItem } from '@/config/paths';
import { cn } from '@/lib/cn';

/** The header's page links; the current page is marked for sight and for screen readers. */
export const MainNav = ({ items }: { items: readonly NavItem[] }) => {
  const { pathname } = useLocation();
  return (
    <nav aria-label="Main">
      <ul className="flex flex-wrap gap-2">
        {items.map((item) => {
          // The page itself, its sub-pages, and a client's pages under the list they were opened from.
          const current =
            pathname === item.to ||
            pathname.startsWith(`${item.to}/`) ||
            Boolean(item.alsoFor?.some((prefix) => pathname.startsWith(prefix)));
          return (
            <li key={item.to}>
              <Link
                to={item.to}
                aria-current={current ? 'page' : undefined}
                className={cn(
                  'inline-flex min-h-11 items-center rounded-lg px-3 text-lg text-paper underline-offset-8',
                  current ? 'font-bold underline decoration-saffron decoration-4' : 'hover:underline',
                )}
              >
                {item.label}
              </Link>
            </li>
          );
        })}
      </ul>
    </nav>
  );
};
