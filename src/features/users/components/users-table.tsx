import { ROLE_LABELS, ROLES, type Role } from '#shared/auth/roles.ts';
import type { UserSummary } from '#shared/schemas/users.schema.ts';
import { Button } from '@/components/ui/button.tsx';
import { Notice } from '@/components/ui/notice.tsx';
import { SortableTable, type SortableColumn } from '@/components/ui/sortable-table.tsx';
import { useUpdateUser } from '../api/users.ts';

export function UsersTable({
  users,
  currentUserId,
}: {
  users: UserSummary[];
  currentUserId: number;
}) {
  const update = useUpdateUser();

  const columns: SortableColumn<UserSummary>[] = [
    { id: 'name', accessorKey: 'name', header: 'Name', sortFn: 'text' },
    {
      id: 'email',
      accessorKey: 'email',
      header: 'E-mail',
      sortFn: 'text',
      cell: ({ getValue }) => <span className="font-mono text-sm">{String(getValue())}</span>,
    },
    {
      id: 'role',
      accessorKey: 'role',
      header: 'Role',
      cell: ({ row }) => (
        <select
          aria-label={`Role of ${row.original.name}`}
          className="rounded-md border border-rule-strong bg-paper-raised px-2 py-1"
          value={row.original.role}
          disabled={update.isPending}
          onChange={(e) => update.mutate({ id: row.original.id, role: e.target.value as Role })}
        >
          {ROLES.map((role) => (
            <option key={role} value={role}>
              {ROLE_LABELS[role]}
            </option>
          ))}
        </select>
      ),
    },
    {
      id: 'active',
      accessorFn: (u) => (!u.active ? 'Deactivated' : u.invited ? 'Invited' : 'Active'),
      header: 'Status',
      cell: ({ row }) =>
        row.original.active && row.original.invited ? (
          <span className="text-caution" title="Has not set a password from the invitation yet">
            <span aria-hidden>◌ </span>Invited
          </span>
        ) : row.original.active ? (
          <span>
            <span aria-hidden>● </span>Active
          </span>
        ) : (
          <span className="text-ink-faint">
            <span aria-hidden>○ </span>Deactivated
          </span>
        ),
    },
    {
      id: 'actions',
      header: () => <span className="sr-only">Actions</span>,
      enableSorting: false,
      cell: ({ row }) =>
        row.original.id === currentUserId ? (
          <span className="text-sm text-ink-faint">You</span>
        ) : (
          <Button
            size="sm"
            variant={row.original.active ? 'danger' : 'secondary'}
            disabled={update.isPending}
            onClick={() => update.mutate({ id: row.original.id, active: !row.original.active })}
          >
            {row.original.active ? 'Deactivate' : 'Reactivate'}
          </Button>
        ),
    },
  ];

  return (
    <div className="flex flex-col gap-3">
      {update.error ? (
        <Notice tone="fault" title="That change was not saved">
          {update.error.message}
        </Notice>
      ) : null}
      <SortableTable
        caption="People in this workshop"
        columns={columns}
        data={users}
        getRowId={(u) => String(u.id)}
        initialSorting={[{ id: 'name', desc: false }]}
      />
    </div>
  );
}
