import { useState } from 'react';
import { Link, NavLink, Outlet, useLocation, useNavigate, useNavigation } from 'react-router-dom';
import { Button, buttonClasses } from '../../components/button';
import { Dialog } from '../../components/dialog';
import { FieldSync } from '../../features/field/components/field-sync';
import { OutboxBadge } from '../../features/field/components/outbox-badge';
import { useAppUpdate } from '../../lib/app-updates';
import { unsent, useOnline, useOutbox } from '../../lib/field/use-field-state';
import { Notice } from '../../components/notice';
import { Wordmark } from '../../components/brand-mark';
import { CrossIcon, MenuIcon } from '../../components/icons';
import { useSignOut } from '../../features/auth/api/sign-out';
import { useSession } from '../../features/auth/components/session-context';
import { can, roleTitles } from '../../lib/roles';
import { navItems } from './nav-items';

const navId = 'main-navigation';

/** The technician's pages that work from the phone's field copy without signal; the rest wait for signal. */
const worksWithoutSignal = /^\/($|kits\/[^/]+$|fleet\/(?!new$)[^/]+$|checks\/new$|incidents\/new$|scan(\/.*)?$|outbox$)/;

function NeedsSignal() {
  return (
    <Notice tone="info" title="This page needs signal">
      Without signal, Nestkeeper shows the kit you carry, records checks and damage reports on this phone, and finds items by their label.{' '}
      <Link to="/" className="font-semibold underline">
        Go to your kit
      </Link>
    </Notice>
  );
}

/** Page frame: ink top bar, navigation by role (side rail; a bottom-sheet menu on phones), content. */
export function AppShell() {
  const { user, organization } = useSession();
  const location = useLocation();
  const navigation = useNavigation();
  const navigate = useNavigate();
  const session = useSession();
  const signOut = useSignOut({ onSignedOut: () => navigate('/sign-in', { replace: true }) });
  const fieldWork = can(user.role, 'checks.record');
  const unsentRecords = unsent(useOutbox());
  const [askingSignOut, setAskingSignOut] = useState(false);
  const update = useAppUpdate();
  const online = useOnline();
  // The phone menu is open only on the page where it was opened, so following a link closes it.
  const [menuOpenAt, setMenuOpenAt] = useState<string | null>(null);
  const menuOpen = menuOpenAt === location.pathname;

  const items = navItems.filter((item) => !item.capability || can(user.role, item.capability));
  const loadingPage = navigation.state === 'loading';

  return (
    <div className="flex min-h-dvh flex-col">
      <a
        href="#main"
        className="sr-only focus:not-sr-only focus:absolute focus:left-2 focus:top-2 focus:z-50 focus:rounded focus:bg-card focus:px-3 focus:py-2"
      >
        Skip to content
      </a>

      <header className="on-ink sticky top-0 z-30 bg-ink-900 text-paper print:hidden">
        <div className="flex h-14 items-center gap-3 px-3 sm:px-5">
          <NavLink to="/" className="rounded text-paper" aria-label="Nestkeeper home">
            <Wordmark size={26} />
          </NavLink>
          <span className="hidden truncate text-sm text-ink-300 md:inline">{organization.name}</span>
          <div className="ml-auto flex min-w-0 items-center gap-3">
            {/* On a phone the badge of records to send takes the name's place. */}
            <p className={`min-w-0 truncate text-right text-sm leading-tight ${fieldWork && unsentRecords.length ? 'max-sm:hidden' : ''}`}>
              <span className="block truncate font-semibold">{user.name}</span>
              <span className="block truncate text-brass-soft">{roleTitles[user.role]}</span>
            </p>
            {fieldWork ? <OutboxBadge /> : null}
            <button
              type="button"
              // Records not yet on the server would be erased with the rest of this phone's copy: ask first.
              onClick={() => (unsentRecords.length ? setAskingSignOut(true) : signOut.mutate())}
              disabled={signOut.isPending}
              className="min-h-9 shrink-0 rounded-md border border-ink-700 px-3 text-sm font-semibold text-paper hover:bg-ink-800"
            >
              Sign out
            </button>
          </div>
        </div>
        <div aria-hidden="true" className={`h-0.5 bg-brass transition-opacity ${loadingPage ? 'animate-pulse opacity-100' : 'opacity-0'}`} />
        {loadingPage ? (
          <span role="status" className="sr-only">
            Loading page…
          </span>
        ) : null}
      </header>

      {update ? (
        <div role="status" className="flex flex-wrap items-center gap-3 border-b border-brass bg-brass-wash px-3 py-2 text-sm sm:px-5 print:hidden">
          <span>A new version of Nestkeeper is ready. Finish and save what you are writing first.</span>
          <button type="button" onClick={update} className="min-h-9 rounded-md border border-brass-deep px-3 font-semibold text-ink-900 hover:bg-brass/30">
            Reload for the new version
          </button>
        </div>
      ) : null}
      {fieldWork ? <FieldSync session={session} /> : null}
      <Dialog
        open={askingSignOut}
        onClose={() => setAskingSignOut(false)}
        title="Sign out with records not sent?"
        description={`${unsentRecords.length} check${unsentRecords.length === 1 ? '' : 's'} or damage report${unsentRecords.length === 1 ? '' : 's'} on this phone ${unsentRecords.length === 1 ? 'has' : 'have'} not reached the server. Signing out erases ${unsentRecords.length === 1 ? 'it' : 'them'} from this phone for good.`}
      >
        <div className="flex flex-wrap gap-2">
          <Button variant="primary" onClick={() => setAskingSignOut(false)}>
            Stay signed in
          </Button>
          <Link to="/outbox" onClick={() => setAskingSignOut(false)} className={buttonClasses('secondary')}>
            See what waits
          </Link>
          <Button
            variant="danger"
            onClick={() => {
              setAskingSignOut(false);
              signOut.mutate();
            }}
          >
            Sign out and erase {unsentRecords.length === 1 ? 'it' : 'them'}
          </Button>
        </div>
      </Dialog>

      <div className="flex flex-1">
        <nav
          id={navId}
          aria-label="Main navigation"
          className={`${menuOpen ? 'fixed inset-x-0 bottom-14 z-40 rounded-t-xl shadow-2xl' : 'hidden'} print:hidden on-ink bg-ink-900 p-3 sm:static sm:block sm:w-52 sm:shrink-0 sm:rounded-none sm:bg-ink-800 sm:p-3 sm:shadow-none`}
        >
          <ul className="flex flex-col gap-1">
            {items.map((item) => (
              <li key={item.to}>
                <NavLink
                  to={item.to}
                  end={item.end}
                  className={({ isActive }) =>
                    `flex min-h-11 items-center rounded-md border-l-4 px-3 text-base sm:min-h-9 ${
                      isActive ? 'border-brass bg-ink-700 font-semibold text-paper' : 'border-transparent text-ink-100 hover:bg-ink-700'
                    }`
                  }
                >
                  {item.label}
                </NavLink>
              </li>
            ))}
          </ul>
        </nav>

        <main id="main" tabIndex={-1} className="min-w-0 flex-1 px-3 pt-5 pb-24 outline-none sm:px-6 sm:pb-10 print:p-0">
          <div className="mx-auto max-w-6xl">{online || worksWithoutSignal.test(location.pathname) ? <Outlet /> : <NeedsSignal />}</div>
        </main>
      </div>

      {/* Phones: the menu button sits at the bottom, under the thumb. */}
      {menuOpen ? <div aria-hidden="true" className="fixed inset-0 z-30 bg-ink-950/50 sm:hidden" onClick={() => setMenuOpenAt(null)} /> : null}
      <div className="on-ink fixed inset-x-0 bottom-0 z-40 flex h-14 items-center border-t border-ink-700 bg-ink-900 px-3 sm:hidden print:hidden">
        <button
          type="button"
          aria-expanded={menuOpen}
          aria-controls={navId}
          onClick={() => setMenuOpenAt(menuOpen ? null : location.pathname)}
          className="flex min-h-11 flex-1 items-center justify-center gap-2 rounded-md font-semibold text-paper hover:bg-ink-800"
        >
          {menuOpen ? <CrossIcon size={20} /> : <MenuIcon size={20} />}
          {menuOpen ? 'Close menu' : 'Menu'}
        </button>
      </div>
    </div>
  );
}
