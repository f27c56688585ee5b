import { FUSE_FAMILIES } from '#shared/domain/electrical/fuses.ts';
import { useMemo } from 'react';
import { Link } from 'react-router-dom';
import { DROP_LIMIT_PCT } from '#shared/domain/electrical/voltage-drop.ts';
import type { Finding } from '#shared/schemas/checks.schema.ts';
import { DROP_CLASS_LABELS, WIRE_ZONE_LABELS, type Feed } from '#shared/schemas/feeds.schema.ts';
import type { SizeUnit } from '#shared/schemas/workshop.schema.ts';
import { formatWireSize } from '#shared/domain/wire-sizes.ts';
import { AllClearLabel, SeverityLabel } from '@/components/ui/severity.tsx';
import { SortableTable, type SortableColumn } from '@/components/ui/sortable-table.tsx';
import { WireColour } from '@/components/ui/wire-colour.tsx';
import {
  findingsByFeed,
  fuseLabel,
  num,
  sourceLabel,
  totalLoadA,
  worstRank,
  type PinChoice,
} from '../lib/feed-display.ts';
import { upstreamFuse } from '../lib/feed-live-calc.ts';

export type ChecksState =
  { status: 'pending' } | { status: 'error' } | { status: 'ready'; findings: Finding[] };

const RETURN_WORDS = { wire: 'own return wire', chassis: 'chassis return' } as const;

const linkClass =
  'font-semibold text-ink underline decoration-rule-strong underline-offset-4 hover:decoration-copper';

function CheckCell({ checks, findings }: { checks: ChecksState; findings: Finding[] | undefined }) {
  if (checks.status === 'pending') return <span className="text-sm text-ink-faint">Checking…</span>;
  if (checks.status === 'error') return <span className="text-sm text-ink-faint">Not checked</span>;
  if (!findings?.length) return <AllClearLabel>No findings</AllClearLabel>;
  return (
    <ul className="min-w-[15rem] space-y-1.5">
      {findings.map((f) => (
        <li key={f.id} className="flex items-start gap-2 text-sm">
          <SeverityLabel severity={f.severity} className="w-[5.75rem] shrink-0" />
          <span className="text-ink-soft">{f.title}</span>
        </li>
      ))}
    </ul>
  );
}

/** The conversion's feeds, one row each, with what the checks found about each. */
export function FeedsTable({
  feeds,
  pins,
  sizeUnit,
  checks,
  canEdit,
  hrefOf,
  circuitHrefOf,
}: {
  feeds: Feed[];
  pins: Map<number, PinChoice>;
  sizeUnit: SizeUnit;
  checks: ChecksState;
  canEdit: boolean;
  hrefOf: (feedId: number) => string;
  /** Where "Show circuit" leads for a feed. */
  circuitHrefOf: (feedId: number) => string;
}) {
  const columns = useMemo<SortableColumn<Feed>[]>(() => {
    const byFeed = checks.status === 'ready' ? findingsByFeed(checks.findings) : new Map();
    const cols: SortableColumn<Feed>[] = [
      {
        id: 'name',
        accessorFn: (f) => f.name,
        header: 'Feed and source',
        sortFn: 'text',
        cell: ({ row }) => (
          <div className="min-w-[10rem]">
            <Link to={hrefOf(row.original.id)} className={linkClass}>
              {row.original.name}
            </Link>
            <div className="mt-0.5 text-sm text-ink-soft">{sourceLabel(row.original, feeds)}</div>
            <Link
              to={circuitHrefOf(row.original.id)}
              className="text-xs text-copper-deep underline-offset-2 hover:underline"
            >
              Show circuit<span className="sr-only"> of {row.original.name}</span>
            </Link>
            <div
              className="text-xs text-ink-faint"
              title={DROP_CLASS_LABELS[row.original.dropClass]}
            >
              Drop limit{' '}
              {row.original.dropLimitPct != null
                ? `${num(row.original.dropLimitPct)} % (set)`
                : `${row.original.dropClass}, ${DROP_LIMIT_PCT[row.original.dropClass]} %`}
            </div>
          </div>
        ),
      },
      {
        id: 'fuse',
        accessorFn: (f) => f.fuseA ?? -1,
        header: 'Fuse',
        cell: ({ row }) => {
          const f = row.original;
          if (f.fuseA != null) {
            const type = f.fuseType ?? 'standard_blade';
            return (
              <span className="whitespace-nowrap">
                <span className="font-mono">{fuseLabel(f.fuseA, type)}</span>
                {type !== 'standard_blade' ? (
                  <span className="block text-xs text-ink-soft">{FUSE_FAMILIES[type].label}</span>
                ) : null}
                {f.unfusedLengthMm != null ? (
                  <span className="block text-xs text-ink-soft">
                    {f.unfusedLengthMm} mm from source{f.fuseSheathed ? ', sheathed' : ''}
                  </span>
                ) : null}
              </span>
            );
          }
          const upstream = f.source === 'relay_output' ? upstreamFuse(f.sourceFeedId, feeds) : null;
          if (upstream) {
            return (
              <span className="text-sm text-ink-soft">
                Upstream: <span className="font-mono">{fuseLabel(upstream.fuseA)}</span>
              </span>
            );
          }
          return (
            <span className="inline-flex items-center gap-1 font-semibold whitespace-nowrap text-fault">
              <span aria-hidden>✕</span> No fuse
            </span>
          );
        },
      },
      {
        id: 'relay',
        accessorFn: (f) => f.relay?.contactRatingA ?? -1,
        header: 'Relay',
        cell: ({ row }) => {
          const relay = row.original.relay;
          if (!relay) return <span className="text-ink-faint">None</span>;
          const coil = relay.coilPinId != null ? pins.get(relay.coilPinId)?.name : null;
          return (
            <div className="whitespace-nowrap">
              <span className="font-mono">{num(relay.contactRatingA)} A</span> contacts
              <div className="text-xs text-ink-faint">
                coil <span className="font-mono">{num(relay.coilCurrentA)} A</span>
                {coil ? (
                  <>
                    {' '}
                    from <span className="font-mono">{coil}</span>
                  </>
                ) : null}
              </div>
            </div>
          );
        },
      },
      {
        id: 'wire',
        accessorFn: (f) => f.wire.sizeMm2,
        header: 'Wire',
        cell: ({ row }) => {
          const w = row.original.wire;
          return (
            <div>
              <span className="inline-flex items-center gap-3 whitespace-nowrap">
                <span className="font-mono font-semibold">
                  {formatWireSize(w.sizeMm2, sizeUnit)}
                </span>
                <WireColour value={w.colour} />
              </span>
              <div className="text-xs text-ink-faint">
                {WIRE_ZONE_LABELS[w.zone]} · <span className="font-mono">{num(w.lengthM)} m</span> ·{' '}
                {RETURN_WORDS[w.returnPath]}
                {w.bundled > 1 ? ` · bundled with ${w.bundled - 1}` : ''}
              </div>
            </div>
          );
        },
      },
      {
        id: 'load',
        accessorFn: (f) => totalLoadA(f).totalA,
        header: 'Load',
        cell: ({ row }) => {
          const { totalA, continuousA } = totalLoadA(row.original);
          const count = row.original.loads.length;
          return (
            <div className="whitespace-nowrap">
              <span className="font-mono font-semibold">{num(totalA)} A</span>
              <div className="text-xs text-ink-faint">
                {count} {count === 1 ? 'load' : 'loads'}
                {continuousA < totalA ? `, ${num(continuousA)} A continuous` : ', continuous'}
              </div>
            </div>
          );
        },
      },
      {
        id: 'check',
        accessorFn: (f) => worstRank(byFeed.get(f.id)),
        header: 'Check',
        cell: ({ row }) => <CheckCell checks={checks} findings={byFeed.get(row.original.id)} />,
      },
    ];
    if (canEdit) {
      cols.push({
        id: 'actions',
        header: () => <span className="sr-only">Actions</span>,
        cell: ({ row }) => (
          <Link
            to={hrefOf(row.original.id)}
            className="inline-block rounded-md border border-rule-strong bg-paper-raised px-2.5 py-1 text-sm font-medium whitespace-nowrap text-ink hover:bg-paper-sunk"
          >
            Edit<span className="sr-only"> {row.original.name}</span>
          </Link>
        ),
      });
    }
    return cols;
  }, [feeds, pins, sizeUnit, checks, canEdit, hrefOf, circuitHrefOf]);

  return (
    <SortableTable
      caption="Feeds of this conversion"
      columns={columns}
      data={feeds}
      getRowId={(f) => String(f.id)}
      empty="No feeds yet."
    />
  );
}
