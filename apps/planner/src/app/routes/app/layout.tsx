import { NavLink, Outlet, useMatches, useNavigate } from 'react-router-dom';
import { Suspense } from 'react';
import { Button } from '@/components/ui/button';
import { ErrorState } from '@/components/ui/error-state';
import { Loading } from '@/components/ui/loading';
import { paths } from '@/config/paths';
import { useMe, useSignOut } from '@/lib/auth';
import { roleLabels } from '@/lib/authorization';
import { navItemsFor } from '../../navigation';
import type { RouteHandle } from '../../router';

function isRouteHandle(value: unknown): value is RouteHandle {
  return typeof value === 'object' && value !== null && 'roles' in value;
}

/** The signed-in shell: navigation for the person's role, sign-out, and the page. */
export default function AppLayout() {
  const me = useMe();
  const signOut = useSignOut();
  const navigate = useNavigate();
  const matches = useMatches();

  if (me.isPending) return <Loading label="Opening Millrace…" />;
  if (me.isError) return <ErrorState error={me.error} onRetry={() => void me.refetch()} />;

  const role = me.data.role;
  const handle = [...matches].reverse().map((m) => m.handle).find(isRouteHandle);
  const allowed = !handle || handle.roles.includes(role);

  return (
    <div className="flex min-h-screen flex-col">
      <a href="#main" className="sr-only focus:not-sr-only focus:absolute focus:left-2 focus:top-2 focus:rounded focus:bg-panel focus:p-2">
        Skip to content
      </a>
      <header className="border-b border-line bg-race-800 text-white">
        <div className="mx-auto flex max-w-screen-2xl items-center gap-4 px-3 py-2">
          <span className="text-lg font-semibold tracking-wide">Millrace</span>
          <nav aria-label="Main" className="flex-1">
            <ul className="flex flex-wrap gap-0.5 text-sm">
              {navItemsFor(role).map((item) => (
                <li key={item.href}>
                  <NavLink
                    to={item.href}
                    end={item.href === paths.home.getHref()}
                    className={({ isActive }) =>
                      `block rounded px-1.5 py-1 ${isActive ? 'bg-white font-semibold text-race-800 underline decoration-2 underline-offset-4' : 'hover:bg-race-700'}`
                    }
                  >
                    {item.label}
                  </NavLink>
                </li>
              ))}
            </ul>
          </nav>
          <div className="flex items-center gap-3 text-sm">
            <span>
              {me.data.name} <span className="rounded bg-race-700 px-1.5 py-0.5">{roleLabels[role]}</span>
            </span>
            <NavLink to={paths.changePassword.getHref()} className="rounded px-1.5 py-1 underline hover:bg-race-700">
              Change password
            </NavLink>
            <Button
              size="sm"
              busy={signOut.isPending}
              busyLabel="Signing out…"
              onClick={() =>
                signOut.mutate(undefined, {
                  onSettled: () => void navigate(paths.signIn.getHref(), { replace: true }),
                })
              }
            >
              Sign out
            </Button>
          </div>
        </div>
      </header>
      <main id="main" tabIndex={-1} className="mx-auto w-full max-w-screen-2xl flex-1 px-4 py-6">
        {allowed ? (
          <Suspense fallback={<Loading />}>
            <Outlet />
          </Suspense>
        ) : (
          <ErrorState
            title="Not available for your role"
            error={new Error(`${handle?.title ?? 'This page'} is not part of the ${roleLabels[role].toLowerCase()} role. Use the links above.`)}
          />
        )}
      </main>
    </div>
  );
}
