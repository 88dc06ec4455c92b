import { cautions } from '@keyloom/shared';
import type { MouseEvent, ReactNode } from 'react';
import { Link } from 'react-router-dom';
import { env } from '@/config/env';
import { paths } from '@/config/paths';
import { KeyloomMark } from './keyloom-mark';

type AppShellProps = {
  /** The role's navigation links (absent before sign-in). */
  navigation?: ReactNode;
  /** The user menu (absent before sign-in). */
  userMenu?: ReactNode;
  children: ReactNode;
};

// Focus <main> directly rather than following "#main": the router owns the URL.
const skipToMain = (event: MouseEvent<HTMLAnchorElement>) => {
  const main = document.getElementById('main');
  if (!main) return;
  event.preventDefault();
  main.focus(); // focusing also scrolls it into view
};

/** Keyloom's frame: skip link, header with wordmark, navigation and user menu, main, footer. */
// The data caution in the words every report uses, its lead in bold: "Language samples are personal
// health information: collect them only with consent, …".
const [lead, ...rest] = cautions.personalData.split(': ');
const dataCaution = { lead, rest: rest.join(': ') };

export const AppShell = ({ navigation, userMenu, children }: AppShellProps) => (
  <div className="flex min-h-screen flex-col">
    <a
      href="#main"
      onClick={skipToMain}
      className="sr-only z-50 rounded-lg border-2 border-ink bg-saffron text-lg font-bold text-ink [--focus-ring:var(--color-paper)] focus:not-sr-only focus:px-5 focus:py-3 focus:absolute focus:top-3 focus:left-3"
    >
      Skip to main content
    </a>
    <header className="on-dark border-b-4 border-saffron bg-ink text-paper">
      <div className="mx-auto flex max-w-6xl flex-wrap items-center gap-x-8 gap-y-3 px-4 py-3 sm:px-6">
        <Link
          to={paths.home}
          className="flex min-h-11 items-center gap-3 rounded-lg text-2xl font-bold tracking-wide text-paper no-underline"
        >
          <KeyloomMark />
          <span>Keyloom</span>
        </Link>
        {navigation}
        {userMenu && <div className="ml-auto">{userMenu}</div>}
      </div>
    </header>
    <main id="main" tabIndex={-1} className="mx-auto w-full max-w-6xl flex-1 px-4 py-8 sm:px-6 sm:py-10">
      {children}
    </main>
    <footer className="border-t-2 border-thread bg-paper-deep">
      <div className="mx-auto flex max-w-6xl flex-col gap-3 px-4 py-6 text-ink-soft sm:px-6">
        <p className="max-w-4xl">
          <strong className="text-ink">{dataCaution.lead}:</strong> {dataCaution.rest}
        </p>
        <p>
          For staff:{' '}
          <a
            href={env.API_DOCS_URL}
            className="inline-flex min-h-11 items-center font-bold text-ink underline"
          >
            API reference
          </a>
        </p>
      </div>
    </footer>
  </div>
);
