import { Link } from 'react-router-dom';
import {
  CONVERSION_STATE_LABELS,
  type ConversionListItem as Conversion,
  type ConversionState,
} from '#shared/schemas/conversions.schema.ts';
import { SortableTable, type SortableColumn } from '@/components/ui/sortable-table.tsx';
import { paths } from '@/config/paths.ts';
import { formatDate } from '@/lib/format-date.ts';

const STATE_STYLE: Record<ConversionState, string> = {
  draft: 'border-rule-strong text-ink-soft',
  in_review: 'border-copper text-copper',
  changes_requested: 'border-caution text-caution',
  signed_off: 'border-sound text-sound',
};
const STATE_ORDER: Record<ConversionState, number> = {
  in_review: 0,
  changes_requested: 1,
  draft: 2,
  signed_off: 3,
};

const pct = (part: number, total: number) => (total ? Math.round((part / total) * 100) : 0);

export function StateBadge({ state }: { state: ConversionState }) {
  return (
    <span
      className={`inline-block whitespace-nowrap rounded border px-1.5 text-xs font-bold uppercase ${STATE_STYLE[state]}`}
    >
      {CONVERSION_STATE_LABELS[state]}
    </span>
  );
}

const columns: SortableColumn<Conversion>[] = [
  {
    id: 'name',
    accessorKey: 'name',
    header: 'Conversion',
    sortFn: 'text',
    cell: ({ row }) => (
      <div className="flex flex-col gap-0.5">
        <span className="flex flex-wrap items-center gap-2">
          <Link
            to={paths.conversion.getHref(row.original.id)}
            className="font-semibold text-ink underline decoration-rule-strong underline-offset-4 hover:decoration-copper"
          >
            {row.original.name}
          </Link>
          {row.original.waitingForYou ? (
            <span className="rounded bg-copper px-1.5 text-xs font-bold text-paper">
              Waiting for your review
            </span>
          ) : null}
        </span>
        <span className="text-sm text-ink-soft">
          {row.original.donorEngine} → {row.original.receivingVehicle} ·{' '}
          <span className="font-mono">{row.original.systemVoltage} V</span>
        </span>
      </div>
    ),
  },
  {
    id: 'state',
    accessorFn: (c) => STATE_ORDER[c.state],
    header: 'State',
    cell: ({ row }) => <StateBadge state={row.original.state} />,
  },
  {
    id: 'latestRevision',
    accessorFn: (c) => c.latestRevision?.number ?? 0,
    header: 'Latest revision',
    cell: ({ row }) => {
      const r = row.original.latestRevision;
      if (!r) return <span className="text-ink-faint">None yet</span>;
      return (
        <Link
          to={paths.conversionRevision.getHref(row.original.id, r.number)}
          className="whitespace-nowrap underline decoration-rule-strong underline-offset-4"
        >
          Revision {r.number}
        </Link>
      );
    },
  },
  {
    id: 'bench',
    accessorFn: (c) => (c.bench ? pct(c.bench.progress.done, c.bench.progress.total) : -1),
    header: 'Bench',
    cell: ({ row }) => {
      const bench = row.original.bench;
      if (!bench) return <span className="text-ink-faint">Nothing signed off</span>;
      const { total, done, tested } = bench.progress;
      // A sign-off in the last three days is news for the bench.
      const fresh = Date.now() - new Date(bench.signedAt).getTime() < 3 * 86_400_000;
      return (
        <span className="flex flex-col gap-1">
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
          </span>
          <span className="text-sm text-ink-soft">
            {pct(done, total)} % done, {pct(tested, total)} % tested
          </span>
          <span
            className="block h-1.5 w-40 overflow-hidden rounded bg-paper-sunk"
            aria-hidden
            title={`${done} of ${total} done`}
          >
            <span className="block h-full bg-sound" style={{ width: `${pct(done, total)}%` }} />
          </span>
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
    id: 'lastChangeAt',
    accessorFn: (c) => new Date(c.lastChangeAt),
    header: 'Last change',
    sortFn: 'datetime',
    cell: ({ row }) => (
      <time dateTime={row.original.lastChangeAt} className="whitespace-nowrap text-ink-soft">
        {formatDate(row.original.lastChangeAt)}
      </time>
    ),
  },
];

/** Waiting for the reader's review first, then the most recently changed. */
export function listOrder(a: Conversion, b: Conversion): number {
  return (
    Number(b.waitingForYou) - Number(a.waitingForYou) ||
    Date.parse(b.lastChangeAt) - Date.parse(a.lastChangeAt)
  );
}

export function ConversionsTable({ conversions }: { conversions: Conversion[] }) {
  return (
    <SortableTable
      caption="Conversions in this workshop"
      columns={columns}
      data={conversions}
      getRowId={(c) => String(c.id)}
      empty="No conversions match."
    />
  );
}
