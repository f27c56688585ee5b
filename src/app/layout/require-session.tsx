import { useEffect } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import { Link, Navigate, Outlet, useLocation } from 'react-router-dom';
import type { Right } from '#shared/auth/roles.ts';
import { Loading } from '@/components/ui/loading.tsx';
import { Notice } from '@/components/ui/notice.tsx';
import { paths } from '@/config/paths.ts';
import { sessionKeys, useSession } from '@/features/auth/api/get-session.ts';
import { useCan } from '@/features/auth/hooks/use-can.ts';
import { setUnauthenticatedHandler } from '@/lib/api-client.ts';
import mark from '@/assets/loomwright-mark.svg';
import { AppShell } from './app-shell.tsx';

/** Everything behind sign-in: shows the app shell, or sends the visitor to the sign-in page. */
export function RequireSession() {
  const session = useSession();
  const location = useLocation();
  const queryClient = useQueryClient();

  useEffect(() => {
    // An expired or revoked session anywhere in the app returns to sign-in.
    setUnauthenticatedHandler(() => queryClient.setQueryData(sessionKeys.all, null));
    return () => setUnauthenticatedHandler(null);
  }, [queryClient]);

  if (session.isPending) return <Loading what="Checking your session" />;
  if (session.isError) {
    return (
      <div className="mx-auto max-w-lg p-8">
        <Notice tone="fault" title="Loomwright cannot reach its server">
          {session.error.message}
        </Notice>
      </div>
    );
  }
  if (!session.data) {
    return <Navigate to={paths.signIn.getHref(location.pathname + location.search)} replace />;
  }
  return (
    <AppShell user={session.data}>
      <Outlet />
    </AppShell>
  );
}

/** A page only some roles may open; the server refuses the same requests anyway. */
export function RequireRight({ right }: { right: Right }) {
  const allowed = useCan(right);
  if (!allowed) {
    return (
      <Notice tone="caution" title="Not available to your role">
        Ask the workshop admin if you need this page.
      </Notice>
    );
  }
  return <Outlet />;
}

/**
 * A page anyone may read (Help): inside the app shell when signed in, under a plain header with
 * the way to sign in when not.
 */
export function SessionOptional() {
  const session = useSession();
  if (session.isPending) return <Loading what="Loading Loomwright" />;
  if (session.data) {
    return (
      <AppShell user={session.data}>
        <Outlet />
      </AppShell>
    );
  }
  return (
    <div className="min-h-screen">
      <header className="border-b border-rule bg-paper-raised print:hidden">
        <div className="mx-auto flex max-w-[1400px] items-center gap-6 px-5 py-3">
          <Link to={paths.signIn.getHref()} className="flex items-center gap-2.5">
            <img src={mark} alt="" className="size-8" />
            <span className="text-lg font-bold tracking-tight">Loomwright</span>
          </Link>
          <Link
            to={paths.signIn.getHref()}
            className="ml-auto rounded-md px-3 py-1.5 text-[0.9375rem] font-medium text-ink-soft hover:bg-paper-sunk hover:text-ink"
          >
            Sign in
          </Link>
        </div>
      </header>
      <main className="mx-auto max-w-[1400px] px-5 py-6">
        <Outlet />
      </main>
    </div>
  );
}
