import { Link, Navigate, useNavigate, useSearchParams } from 'react-router-dom';
import { paths } from '@/config/paths.ts';
import { useSession } from '@/features/auth/api/get-session.ts';
import { SignInForm } from '@/features/auth/components/sign-in-form.tsx';
import mark from '@/assets/loomwright-mark.svg';

/** Only same-site paths are followed after sign-in. */
function safeNext(next: string | null): string {
  return next && next.startsWith('/') && !next.startsWith('//')
    ? next
    : paths.conversions.getHref();
}

export function SignInRoute() {
  const [params] = useSearchParams();
  const navigate = useNavigate();
  const session = useSession();
  const next = safeNext(params.get('next'));
  if (session.data) return <Navigate to={next} replace />;
  return (
    <div className="grid min-h-screen place-items-center px-4">
      <div className="w-full max-w-sm">
        <div className="mb-6 flex items-center gap-3">
          <img src={mark} alt="" className="size-11" />
          <div>
            <h1 className="text-2xl font-bold tracking-tight">Loomwright</h1>
            <p className="text-sm text-ink-soft">Harness conversion records for the swap shop</p>
          </div>
        </div>
        <div className="rounded-lg border border-rule bg-paper-raised p-6 shadow-[0_1px_0_var(--color-rule)]">
          <SignInForm onSignedIn={() => navigate(next, { replace: true })} />
        </div>
        <p className="mt-4 text-center text-sm text-ink-soft">
          New here?{' '}
          <Link to={paths.help.getHref()} className="font-medium text-ink underline">
            Read the help
          </Link>{' '}
          — the tour, the words and every rule the checks apply.
        </p>
      </div>
    </div>
  );
}
