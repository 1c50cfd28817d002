import { Link, NavLink, Outlet, useNavigate } from 'react-router-dom';
import { can, type Action } from '@shared/auth/permissions';
import type { SessionUserDto } from '@shared/schemas/auth';
import { BrandMark } from '@/components/ui/brand-mark';
import { paths } from '@/config/paths';
import { useSignOut } from '@/features/auth/api/sign-out';
import { AccountMenu } from './account-menu';

interface NavItem {
  to: string;
  label: string;
  /** Shown only to roles that may perform this action. */
  action: Action;
}

const navigation: NavItem[] = [
  { to: paths.home.href(), label: 'Overview', action: 'read' },
  { to: paths.registry.href(), label: 'Registry', action: 'read' },
  { to: paths.landscape.href(), label: 'Landscape', action: 'read' },
  { to: paths.assayEntry.href(), label: 'Assay entry', action: 'measurements:write' },
  { to: paths.enzymes.href(), label: 'Enzymes', action: 'read' },
  { to: paths.imports.href(), label: 'Imports', action: 'imports:write' },
  { to: paths.review.href(), label: 'Review', action: 'measurements:review' },
  { to: paths.digests.href(), label: 'Digests', action: 'read' },
  { to: paths.outbox.href(), label: 'Outbox', action: 'users:manage' },
  { to: paths.adminUsers.href(), label: 'Admin', action: 'users:manage' },
];

export function AppShell({ user }: { user: SessionUserDto }) {
  const navigate = useNavigate();
  const signOut = useSignOut();

  const handleSignOut = () => {
    signOut.mutate(undefined, { onSuccess: () => navigate(paths.signIn.href(), { replace: true }) });
  };

  return (
    <div className="flex min-h-screen flex-col">
      <a href="#main" className="sr-only focus:not-sr-only focus:absolute focus:left-2 focus:top-2 focus:z-50 focus:rounded focus:bg-white focus:px-3 focus:py-2">
        Skip to content
      </a>
      <header className="bg-lagoon-900 text-paper-100">
        {/* One line from 1280 px; narrower, the pages move to a second line of their own under the name and account. */}
        <div className="mx-auto flex max-w-7xl flex-wrap items-center gap-x-6 gap-y-2 px-4 py-2.5">
          <NavLink to={paths.home.href()} className="flex items-center gap-2 text-lg font-semibold tracking-tight text-white">
            <BrandMark />
            Kcatalog
          </NavLink>
          <nav aria-label="Main" className="order-last flex w-full flex-wrap gap-1 xl:order-none xl:w-auto xl:flex-1">
            {navigation
              .filter((item) => can(user.role, item.action))
              .map((item) => (
                <NavLink
                  key={item.to}
                  to={item.to}
                  // Home is a prefix of every path; it is current only on itself.
                  end={item.to === paths.home.href()}
                  className={({ isActive }) =>
                    `rounded-md px-2.5 py-1.5 text-sm font-medium ${isActive ? 'bg-lagoon-700 text-white' : 'text-lagoon-100 hover:bg-lagoon-800 hover:text-white'}`
                  }
                >
                  {item.label}
                </NavLink>
              ))}
          </nav>
          <div className="ml-auto flex items-center gap-2 text-sm">
            <AccountMenu user={user} />
            <button type="button" onClick={handleSignOut} className="rounded-md border border-lagoon-600 px-2.5 py-1 text-lagoon-100 hover:bg-lagoon-800">
              Sign out
            </button>
          </div>
        </div>
      </header>
      <main id="main" className="mx-auto w-full max-w-7xl flex-1 px-4 py-6">
        <Outlet />
      </main>
      <footer className="border-t border-paper-200 py-3 text-center text-xs text-ink-500">
        For research use only. Fitted values are estimates; the scientist decides.{' '}
        <Link to={paths.about.href()} className="font-medium text-lagoon-700 underline underline-offset-2 hover:text-lagoon-900">
          About Kcatalog
        </Link>
      </footer>
    </div>
  );
}
