import { memo, useState } from 'react';
import { CONNECTOR_SIDE_LABELS, type Connector, type Pin } from '#shared/schemas/pin-map.schema.ts';
import type { SizeUnit } from '#shared/schemas/workshop.schema.ts';
import { Button } from '@/components/ui/button.tsx';
import type { DispositionCounts } from '../lib/progress.ts';
import { ConnectorFace } from './connector-face.tsx';
import { DispositionTally } from './disposition-tally.tsx';
import { plural } from '@/lib/plural.ts';

/**
 * One connector: its face, its progress, and (for writers) change and delete. Memoised: an edit
 * elsewhere on the pin map does not redraw the cards of connectors it did not touch.
 */
export const ConnectorCard = memo(function ConnectorCard({
  connector,
  wide,
  pins,
  counts,
  unit,
  canWrite,
  deleting,
  onActivate,
  onEdit,
  onDelete,
}: {
  connector: Connector;
  /** A face too wide for one column of cards takes two. */
  wide: boolean;
  /** This connector's pins. */
  pins: readonly Pin[];
  counts: DispositionCounts;
  unit: SizeUnit;
  canWrite: boolean;
  deleting: boolean;
  onActivate: (pinId: number) => void;
  /** Called with the connector's id. */
  onEdit: (connectorId: number) => void;
  /** Called with the connector. */
  onDelete: (connector: Connector) => void;
}) {
  const [confirming, setConfirming] = useState(false);
  const pinCount = pins.length;
  return (
    <article
      aria-label={`Connector ${connector.label}`}
      className={`flex min-w-0 flex-col gap-3 rounded-lg border border-rule bg-paper-raised p-4 ${wide ? 'md:col-span-2' : ''}`}
    >
      <header className="flex flex-wrap items-baseline gap-x-3 gap-y-1">
        <h3 className="font-mono text-lg font-bold">{connector.label}</h3>
        <p className="text-sm text-ink-soft">
          {CONNECTOR_SIDE_LABELS[connector.side]} ·{' '}
          {plural(connector.cavityCount, 'cavity', 'cavities')} ·{' '}
          <span className="font-mono">
            {connector.rows} × {connector.columns}
          </span>
        </p>
        {canWrite ? (
          <div className="ml-auto flex gap-1">
            <Button size="sm" variant="quiet" onClick={() => onEdit(connector.id)}>
              Change<span className="sr-only"> connector {connector.label}</span>
            </Button>
            <Button size="sm" variant="quiet" onClick={() => setConfirming(true)}>
              Delete<span className="sr-only"> connector {connector.label}</span>
            </Button>
          </div>
        ) : null}
      </header>
      {confirming ? (
        <div
          role="alertdialog"
          aria-label={`Delete connector ${connector.label}?`}
          className="rounded-md border border-fault/40 bg-fault-wash px-3 py-2 text-sm"
        >
          <p className="text-ink">
            Delete {connector.label} and its {pinCount} pin{pinCount === 1 ? '' : 's'}? Their
            functions, wires and decisions go with it.
          </p>
          <div className="mt-2 flex gap-2">
            <Button size="sm" variant="danger" busy={deleting} onClick={() => onDelete(connector)}>
              Delete {connector.label} and {plural(pinCount, 'pin')}
            </Button>
            <Button size="sm" variant="quiet" onClick={() => setConfirming(false)}>
              Keep it
            </Button>
          </div>
        </div>
      ) : null}
      {connector.notes ? <p className="text-sm text-ink-soft">{connector.notes}</p> : null}
      <ConnectorFace
        connector={connector}
        pins={pins}
        counts={counts}
        unit={unit}
        onActivate={onActivate}
      />
      <DispositionTally counts={counts} compact />
    </article>
  );
});
