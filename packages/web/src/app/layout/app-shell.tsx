import { Suspense } from 'react';
import { Link, NavLink, Outlet, useNavigate } from 'react-router-dom';
import { buttonStyles } from '../../components/ui/button-styles';
import { LoadingState } from '../../components/ui/query-states';
import { useMe } from '../../features/auth/api/get-me';
import { useSignOut } from '../../features/auth/api/sign-out';
import { OrganisationSwitcher } from '../../features/organisations/components/organisation-switcher';
import { useCurrentOrganisation } from '../../features/organisations/use-current-organisation';
import { cn } from '../../lib/cn';

/** Who sees an entry: everyone, people signed in, editors and admins, or admins of the current organisation. */
type NavAccess = 'all' | 'signed-in' | 'editor' | 'admin';

const NAV: readonly { to: string; label: string; end: boolean; access: NavAccess }[] = [
  { to: '/', label: 'Home', end: true, access: 'all' },
  { to: '/preview/dive', label: 'Dive preview', end: false, access: 'all' },
  { to: '/upload', label: 'Upload', end: false, access: 'editor' },
  { to: '/tokens', label: 'API tokens', end: false, access: 'signed-in' },
  { to: '/members', label: 'Members', end: false, access: 'admin' },
];

function navClass({ isActive }: { isActive: boolean }): string {
  return cn(
    'rounded-md px-3 py-1.5 text-sm font-medium focus-visible:outline-3 focus-visible:outline-offset-2 focus-visible:outline-sand',
    isActive ? 'bg-foam text-abyss' : 'text-foam hover:bg-abyss-soft',
  );
}

function AccountArea() {
  const me = useMe();
  const signOut = useSignOut();
  const navigate = useNavigate();
  if (me.isPending) return <span className="text-sm text-foam/80">Checking sign-in…</span>;
  if (me.data) {
    return (
      <div className="flex flex-wrap items-center gap-3 text-sm">
        <span>{me.data.user.displayName}</span>
        <OrganisationSwitcher />
        <button
          type="button"
          className={buttonStyles('quiet', 'text-foam hover:bg-abyss-soft focus-visible:outline-sand')}
          onClick={() => signOut.mutate(undefined, { onSuccess: () => navigate('/sign-in') })}
        >
          Sign out
        </button>
      </div>
    );
  }
  return (
    <NavLink to="/sign-in" className={navClass}>
      Sign in
    </NavLink>
  );
}

function MainNav() {
  const me = useMe();
  const { membership } = useCurrentOrganisation();
  const visible = NAV.filter(
    (item) =>
      item.access === 'all' ||
      (item.access === 'signed-in' && me.data != null) ||
      (item.access === 'editor' && (membership?.role === 'editor' || membership?.role === 'admin')) ||
      (item.access === 'admin' && membership?.role === 'admin'),
  );
  return (
    <nav aria-label="Main" className="mr-auto">
      <ul className="flex flex-wrap gap-1">
        {visible.map((item) => (
          <li key={item.to}>
            <NavLink to={item.to} end={item.end} className={navClass}>
              {item.label}
            </NavLink>
          </li>
        ))}
      </ul>
    </nav>
  );
}

/** The frame of every page: skip link, header with navigation and account, the page, and a footer. */
export function AppShell() {
  return (
    <div className="flex min-h-screen flex-col">
      <a
        href="#main"
        className="sr-only focus:not-sr-only focus:absolute focus:top-2 focus:left-2 focus:z-10 focus:rounded focus:bg-white focus:px-3 focus:py-2"
      >
        Skip to content
      </a>
      <header className="bg-abyss text-foam">
        <div className="mx-auto flex max-w-7xl flex-wrap items-center gap-x-6 gap-y-2 px-4 py-3 sm:px-6">
          <Link
            to="/"
            className="flex items-center gap-2 text-lg font-semibold tracking-wide focus-visible:outline-3 focus-visible:outline-offset-2 focus-visible:outline-sand"
          >
            <img src="/leadline.svg" alt="" className="size-7" />
            Leadline
          </Link>
          <MainNav />
          <AccountArea />
        </div>
      </header>
      <main id="main" className="mx-auto w-full max-w-7xl flex-1 px-4 py-6 sm:px-6">
        <Suspense fallback={<LoadingState label="Loading the page…" />}>
          <Outlet />
        </Suspense>
      </main>
    </div>
  );
}
