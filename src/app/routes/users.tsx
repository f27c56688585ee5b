import { Loading } from '@/components/ui/loading.tsx';
import { Notice } from '@/components/ui/notice.tsx';
import { PageHeader } from '@/components/ui/page-header.tsx';
import { useSession } from '@/features/auth/api/get-session.ts';
import { useUsers } from '@/features/users/api/users.ts';
import { CreateUserForm } from '@/features/users/components/create-user-form.tsx';
import { UsersTable } from '@/features/users/components/users-table.tsx';

export function UsersRoute() {
  const users = useUsers();
  const session = useSession();
  return (
    <>
      <PageHeader title="People" kicker="Admin">
        Who can sign in to this workshop, and in which role. A changed role or a deactivation takes
        effect at once.
      </PageHeader>
      <div className="flex flex-col gap-6">
        {users.isPending ? (
          <Loading what="Loading people" />
        ) : users.isError ? (
          <Notice tone="fault" title="People could not be loaded">
            {users.error.message}
          </Notice>
        ) : (
          <UsersTable users={users.data} currentUserId={session.data?.id ?? 0} />
        )}
        <CreateUserForm />
      </div>
    </>
  );
}
