import { Link } from 'react-router-dom';
import type { ConversionListItem as Conversion } from '#shared/schemas/conversions.schema.ts';
import { SortableTable, type SortableColumn } from '@/components/ui/sortable-table.tsx';
import { paths } from '@/config/paths.ts';
import { formatDate } from '@/lib/format-date.ts';

const columns: SortableColumn<Conversion>[] = [
  {
    id: 'name',
    accessorKey: 'name',
    header: 'Conversion',
    sortFn: 'text',
    cell: ({ row }) => (
      <Link
        to={paths.conversion.getHref(row.original.id)}
        className="font-semibold text-ink underline decoration-rule-strong underline-offset-4 hover:decoration-copper"
      >
        {row.original.name}
      </Link>
    ),
  },
  { id: 'donorEngine', accessorKey: 'donorEngine', header: 'Donor engine', sortFn: 'text' },
  {
    id: 'receivingVehicle',
    accessorKey: 'receivingVehicle',
    header: 'Receiving vehicle',
    sortFn: 'text',
  },
  {
    id: 'systemVoltage',
    accessorKey: 'systemVoltage',
    header: 'System',
    cell: ({ getValue }) => <span className="font-mono">{String(getValue())} V</span>,
  },
  {
    id: 'createdBy',
    accessorFn: (c) => c.createdBy?.name ?? '—',
    header: 'Started by',
    sortFn: 'text',
  },
  {
    id: 'bench',
    accessorFn: (c) => c.bench?.signedAt ?? '',
    header: 'Bench',
    cell: ({ row }) => {
      const bench = row.original.bench;
      if (!bench) return <span className="text-ink-faint">Nothing signed off</span>;
      // A sign-off in the last three days is news for the bench.
      const fresh = Date.now() - new Date(bench.signedAt).getTime() < 3 * 86_400_000;
      return (
        <span className="flex flex-wrap items-center gap-2">
          {fresh ? (
            <span className="rounded border border-copper px-1.5 text-xs font-bold uppercase text-copper">
              New
            </span>
          ) : null}
          <Link
            to={paths.conversionBench.getHref(row.original.id)}
            className="underline decoration-rule-strong underline-offset-4"
          >
            Revision {bench.revisionNumber} signed off {formatDate(bench.signedAt)}
          </Link>
          {bench.reworkOpen ? (
            <span className="font-semibold text-caution">
              <span aria-hidden>! </span>
              {bench.reworkOpen} to rework
            </span>
          ) : null}
        </span>
      );
    },
  },
  {
    id: 'updatedAt',
    accessorFn: (c) => new Date(c.updatedAt),
    header: 'Last change',
    sortFn: 'datetime',
    cell: ({ row }) => (
      <time dateTime={row.original.updatedAt} className="whitespace-nowrap text-ink-soft">
        {formatDate(row.original.updatedAt)}
      </time>
    ),
  },
];

export function ConversionsTable({ conversions }: { conversions: Conversion[] }) {
  return (
    <SortableTable
      caption="Conversions in this workshop"
      columns={columns}
      data={conversions}
      getRowId={(c) => String(c.id)}
      initialSorting={[{ id: 'updatedAt', desc: true }]}
      empty="No conversions yet."
    />
  );
}
