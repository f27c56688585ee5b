import { Link } from 'react-router-dom';
import type { RevisionSummary } from '#shared/schemas/revisions.schema.ts';
import { SortableTable, type SortableColumn } from '@/components/ui/sortable-table.tsx';
import { formatDate } from '@/lib/format-date.ts';
import { RevisionStatusBadge } from './revision-status.tsx';

const when = (iso: string | null) => formatDate(iso);

export function RevisionsTable({
  revisions,
  hrefFor,
}: {
  revisions: RevisionSummary[];
  hrefFor: (n: number) => string;
}) {
  const columns: SortableColumn<RevisionSummary>[] = [
    {
      id: 'number',
      accessorKey: 'number',
      header: 'Revision',
      cell: ({ row }) => (
        <Link
          to={hrefFor(row.original.number)}
          className="font-semibold underline decoration-rule-strong underline-offset-4 hover:decoration-copper"
        >
          Revision {row.original.number}
        </Link>
      ),
    },
    {
      id: 'status',
      accessorKey: 'status',
      header: 'Status',
      cell: ({ row }) => <RevisionStatusBadge status={row.original.status} />,
    },
    {
      id: 'submitted',
      accessorFn: (r) => r.submittedAt,
      header: 'Submitted',
      cell: ({ row }) => (
        <span>
          {row.original.submittedBy}
          <span className="block text-sm text-ink-faint">{when(row.original.submittedAt)}</span>
        </span>
      ),
    },
    {
      id: 'reviewed',
      accessorFn: (r) => r.reviewedAt ?? '',
      header: 'Reviewed',
      cell: ({ row }) =>
        row.original.reviewedBy ? (
          <span>
            {row.original.reviewedBy}
            <span className="block text-sm text-ink-faint">{when(row.original.reviewedAt)}</span>
          </span>
        ) : (
          <span className="text-ink-faint">—</span>
        ),
    },
    {
      id: 'findings',
      accessorFn: (r) => r.counts.warning,
      header: 'Warnings / notes',
      cell: ({ row }) => (
        <span className="font-mono text-sm">
          {row.original.counts.warning} / {row.original.counts.note}
        </span>
      ),
    },
    {
      id: 'hash',
      accessorKey: 'hash',
      header: 'Content hash',
      enableSorting: false,
      cell: ({ row }) => (
        <span className="font-mono text-sm" title={row.original.hash}>
          {row.original.hash.slice(0, 12)}
        </span>
      ),
    },
  ];
  return (
    <SortableTable
      caption="Revisions of this conversion"
      columns={columns}
      data={revisions}
      getRowId={(r) => String(r.number)}
      initialSorting={[{ id: 'number', desc: true }]}
      empty="No revision yet. Submit the plan for review when every pin is decided and the checks pass."
    />
  );
}
