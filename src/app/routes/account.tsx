import { ROLE_LABELS } from '#shared/auth/roles.ts';
import { PageHeader } from '@/components/ui/page-header.tsx';
import { useSession } from '@/features/auth/api/get-session.ts';
import { ChangePasswordForm } from '@/features/auth/components/change-password-form.tsx';

export function AccountRoute() {
  const { data: user } = useSession();
  return (
    <>
      <PageHeader title="Your account" kicker={user ? ROLE_LABELS[user.role] : undefined}>
        {user ? (
          <>
            {user.name} · <span className="font-mono text-sm">{user.email}</span>
          </>
        ) : null}
      </PageHeader>
      <ChangePasswordForm />
    </>
  );
}
