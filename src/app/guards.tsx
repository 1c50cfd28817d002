import type { ReactNode } from 'react';
import { Navigate, useLocation } from 'react-router-dom';
import { can, type Action } from '@shared/auth/permissions';
import { ErrorState, LoadingState } from '@/components/ui/states';
import { AppShell } from '@/components/layout/app-shell';
import { paths } from '@/config/paths';
import { useMe } from '@/features/auth/api/get-me';

/** Shows the app to a signed-in user; anyone else goes to sign-in and comes back afterwards. */
export function SignedInLayout() {
  const me = useMe();
  const location = useLocation();
  if (me.isPending) return <LoadingState label="Checking your session…" />;
  if (me.isError) return <div className="mx-auto max-w-xl p-8"><ErrorState error={me.error} onRetry={() => void me.refetch()} /></div>;
  if (!me.data) return <Navigate to={paths.signIn.href(location.pathname + location.search)} replace />;
  return <AppShell user={me.data} />;
}

/** Renders its page only for roles that may perform the action (the server refuses the rest anyway). */
export function RequirePermission({ action, children }: { action: Action; children: ReactNode }) {
  const me = useMe();
  if (!me.data || !can(me.data.role, action)) {
    return (
      <div role="alert" className="rounded-lg border border-paper-300 bg-white p-6 text-sm">
        <p className="font-semibold">This page is not available to your role.</p>
        <p className="mt-1 text-ink-500">Ask an admin if you need access.</p>
      </div>
    );
  }
  return children;
}
