import { useEffect } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import { Navigate, Outlet, useLocation } from 'react-router-dom';
import type { Right } from '#shared/auth/roles.ts';
import { Loading } from '@/components/ui/loading.tsx';
import { Notice } from '@/components/ui/notice.tsx';
import { paths } from '@/config/paths.ts';
import { sessionKeys, useSession } from '@/features/auth/api/get-session.ts';
import { useCan } from '@/features/auth/hooks/use-can.ts';
import { setUnauthenticatedHandler } from '@/lib/api-client.ts';
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
