import { Link } from 'react-router';
import type { Conversion } from '#shared/schemas/conversions.schema.ts';
import { SortableTable, type SortableColumn } from '@/components/ui/sortable-table.tsx';
import { paths } from '@/config/paths.ts';

const dateFormat = new Intl.DateTimeFormat(undefined, { dateStyle: 'medium', timeStyle: 'short' });

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
    id: 'updatedAt',
    accessorFn: (c) => new Date(c.updatedAt),
    header: 'Last change',
    sortFn: 'datetime',
    cell: ({ row }) => (
      <time dateTime={row.original.updatedAt} className="whitespace-nowrap text-ink-soft">
        {dateFormat.format(new Date(row.original.updatedAt))}
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
