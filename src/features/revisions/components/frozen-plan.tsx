import { useId, useState } from 'react';
import { showField } from '#shared/domain/fields/field-table.ts';
import { PIN_FIELDS } from '#shared/domain/fields/pin-fields.ts';
import { pinNames } from '#shared/domain/pin-names.ts';
import { harnessEndNamer } from '#shared/domain/revisions/diff.ts';
import { SIGNAL_CLASS_LABELS } from '#shared/domain/signal-classes.ts';
import { formatWireSize } from '#shared/domain/wire-sizes.ts';
import { FEED_SOURCE_LABELS, WIRE_ZONE_LABELS } from '#shared/schemas/feeds.schema.ts';
import { CONNECTOR_SIDE_LABELS } from '#shared/schemas/pin-map.schema.ts';
import type {
  ConversionSnapshot,
  SnapshotConnector,
  SnapshotPin,
} from '#shared/schemas/snapshot.schema.ts';
import type { SizeUnit } from '#shared/schemas/workshop.schema.ts';
import { Button } from '@/components/ui/button.tsx';
import { DispositionLabel } from '@/components/ui/disposition-glyph.tsx';
import { WireColour } from '@/components/ui/wire-colour.tsx';

const plural = (n: number, one: string, many = `${one}s`) => `${n} ${n === 1 ? one : many}`;

type Tab = 'pins' | 'feeds' | 'wires' | 'box';

function ConnectorPins({
  connector,
  pins,
  destinationOf,
  unit,
}: {
  connector: SnapshotConnector;
  pins: SnapshotPin[];
  destinationOf: (p: SnapshotPin) => string;
  unit: SizeUnit;
}) {
  return (
    <section aria-label={`Connector ${connector.label}`} className="flex flex-col gap-2">
      <h4 className="font-semibold">
        <span className="font-mono">{connector.label}</span>{' '}
        <span className="text-sm font-normal text-ink-soft">
          · {CONNECTOR_SIDE_LABELS[connector.side]} ·{' '}
          {plural(connector.cavityCount, 'cavity', 'cavities')}
        </span>
      </h4>
      <div className="overflow-x-auto">
        <table className="lw-table w-full border-collapse text-sm">
          <caption className="sr-only">Pins of connector {connector.label} as frozen</caption>
          <thead className="border-b border-rule">
            <tr>
              <th className="px-2 py-1.5">Cavity</th>
              <th className="px-2 py-1.5">Function</th>
              <th className="px-2 py-1.5">Signal</th>
              <th className="px-2 py-1.5">Disposition</th>
              <th className="px-2 py-1.5">Destination</th>
              <th className="px-2 py-1.5">Colour</th>
              <th className="px-2 py-1.5">Size</th>
              <th className="px-2 py-1.5">Notes</th>
            </tr>
          </thead>
          <tbody>
            {pins.map((p) => (
              <tr key={p.id} className="border-b border-rule/60 align-top">
                <th scope="row" className="px-2 py-1.5 font-mono font-semibold">
                  {connector.label}-{p.cavity}
                </th>
                <td className="px-2 py-1.5">{p.function || '—'}</td>
                <td className="px-2 py-1.5">{SIGNAL_CLASS_LABELS[p.signalClass]}</td>
                <td className="px-2 py-1.5">
                  <DispositionLabel disposition={p.disposition} />
                </td>
                <td className="px-2 py-1.5">{destinationOf(p) || '—'}</td>
                <td className="px-2 py-1.5">{p.colour ? <WireColour value={p.colour} /> : '—'}</td>
                <td className="px-2 py-1.5 whitespace-nowrap">
                  {showField(PIN_FIELDS, 'sizeMm2', p.sizeMm2, unit) || '—'}
                </td>
                <td className="px-2 py-1.5 whitespace-pre-wrap text-ink-soft">{p.notes}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </section>
  );
}

/**
 * The plan exactly as the revision froze it: its connectors and pins and its feeds, read from the
 * snapshot and never from today's draft, so a reviewer reads what they sign.
 */
export function FrozenPlan({
  snapshot,
  revisionNumber,
  unit,
  collapsed = false,
}: {
  snapshot: ConversionSnapshot;
  revisionNumber: number;
  unit: SizeUnit;
  /** Shut until asked for: on a later revision the differences come first. */
  collapsed?: boolean;
}) {
  const [tab, setTab] = useState<Tab>('pins');
  const [open, setOpen] = useState(!collapsed);
  const id = useId();
  const names = pinNames(snapshot);
  const feedName = new Map(snapshot.feeds.map((f) => [f.id, f.name]));
  const destinationOf = (p: SnapshotPin) =>
    p.destinationFeedId != null
      ? `Feed: ${feedName.get(p.destinationFeedId) ?? '?'}`
      : p.destinationPinId != null
        ? (names.get(p.destinationPinId) ?? '?')
        : p.destination;
  const pinsOf = (c: SnapshotConnector) =>
    snapshot.pins.filter((p) => p.connectorId === c.id).sort((a, b) => a.position - b.position);
  const harness = snapshot.harness;
  const endName = harnessEndNamer(snapshot);
  const tabs: Array<{ key: Tab; label: string }> = [
    { key: 'pins', label: `Pin map (${plural(snapshot.pins.length, 'pin')})` },
    { key: 'feeds', label: `Feeds (${snapshot.feeds.length})` },
    // Revisions frozen before wires existed have none to show.
    ...(harness
      ? [
          { key: 'wires' as const, label: `Wires (${harness.wires.length})` },
          { key: 'box' as const, label: `Splices, grounds and box` },
        ]
      : []),
  ];

  return (
    <section
      aria-labelledby={`${id}-heading`}
      className="flex flex-col gap-3 rounded-lg border border-rule bg-paper-raised p-5"
    >
      <div>
        <h3 id={`${id}-heading`} className="text-lg font-semibold">
          The plan as frozen in revision {revisionNumber}
        </h3>
        <p className="text-sm text-ink-soft">
          Read-only: what was submitted, not today&rsquo;s draft.
        </p>
      </div>
      {collapsed ? (
        <div>
          <Button size="sm" aria-expanded={open} onClick={() => setOpen((o) => !o)}>
            {open ? 'Hide the whole plan' : 'Show the whole plan'}
          </Button>
        </div>
      ) : null}
      {open ? (
        <>
          <div role="tablist" aria-label="Frozen plan" className="flex gap-1 border-b border-rule">
            {tabs.map((t) => (
              <button
                key={t.key}
                type="button"
                role="tab"
                id={`${id}-${t.key}-tab`}
                aria-selected={tab === t.key}
                aria-controls={`${id}-${t.key}`}
                onClick={() => setTab(t.key)}
                className={`-mb-px rounded-t-md border px-3 py-1.5 text-sm font-medium ${
                  tab === t.key
                    ? 'border-rule border-b-paper-raised bg-paper-raised text-ink'
                    : 'border-transparent text-ink-soft hover:text-ink'
                }`}
              >
                {t.label}
              </button>
            ))}
          </div>
          {tab === 'pins' ? (
            <div
              role="tabpanel"
              id={`${id}-pins`}
              aria-labelledby={`${id}-pins-tab`}
              className="flex flex-col gap-5"
            >
              {snapshot.connectors.length === 0 ? (
                <p className="text-ink-soft">No connectors were in the plan.</p>
              ) : (
                snapshot.connectors.map((c) => (
                  <ConnectorPins
                    key={c.id}
                    connector={c}
                    pins={pinsOf(c)}
                    destinationOf={destinationOf}
                    unit={unit}
                  />
                ))
              )}
            </div>
          ) : tab === 'wires' && harness ? (
            <div role="tabpanel" id={`${id}-wires`} aria-labelledby={`${id}-wires-tab`}>
              {harness.wires.length === 0 ? (
                <p className="text-ink-soft">No wires were in the plan.</p>
              ) : (
                <div className="overflow-x-auto">
                  <table className="lw-table w-full border-collapse text-sm">
                    <caption className="sr-only">Wires as frozen</caption>
                    <thead className="border-b border-rule">
                      <tr>
                        <th className="px-2 py-1.5">Wire</th>
                        <th className="px-2 py-1.5">From</th>
                        <th className="px-2 py-1.5">To</th>
                        <th className="px-2 py-1.5">Colour</th>
                        <th className="px-2 py-1.5">Size</th>
                        <th className="px-2 py-1.5">Length</th>
                        <th className="px-2 py-1.5">Notes</th>
                      </tr>
                    </thead>
                    <tbody>
                      {harness.wires.map((w) => (
                        <tr key={w.id} className="border-b border-rule/60 align-top">
                          <th scope="row" className="px-2 py-1.5 font-mono font-semibold">
                            {w.label}
                          </th>
                          <td className="px-2 py-1.5 font-mono">{endName(w.ends[0])}</td>
                          <td className="px-2 py-1.5 font-mono">{endName(w.ends[1])}</td>
                          <td className="px-2 py-1.5">
                            {w.colour ? <WireColour value={w.colour} /> : '—'}
                          </td>
                          <td className="px-2 py-1.5 whitespace-nowrap">
                            {w.sizeMm2 == null ? '—' : formatWireSize(w.sizeMm2, unit)}
                          </td>
                          <td className="px-2 py-1.5 whitespace-nowrap">
                            {w.lengthM == null ? '—' : `${w.lengthM} m`}
                          </td>
                          <td className="px-2 py-1.5 whitespace-pre-wrap text-ink-soft">
                            {w.notes}
                          </td>
                        </tr>
                      ))}
                    </tbody>
                  </table>
                </div>
              )}
            </div>
          ) : tab === 'box' && harness ? (
            <div
              role="tabpanel"
              id={`${id}-box`}
              aria-labelledby={`${id}-box-tab`}
              className="flex flex-col gap-3 text-sm"
            >
              <p>
                <span className="font-semibold">Splices:</span>{' '}
                {harness.splices.length
                  ? harness.splices
                      .map(
                        (x) =>
                          `${x.label}${x.sealed ? ' (sealed)' : ''}${x.branch ? `, ${x.branch}` : ''}`,
                      )
                      .join('; ')
                  : 'none'}
              </p>
              <p>
                <span className="font-semibold">Ground points:</span>{' '}
                {harness.groundPoints.length
                  ? harness.groundPoints
                      .map((g) => `${g.label} (${g.location.replace('_', ' ')})`)
                      .join('; ')
                  : 'none'}
              </p>
              {harness.boxes.length === 0 ? (
                <p>
                  <span className="font-semibold">Fuse and relay box:</span> none
                </p>
              ) : (
                harness.boxes.map((b) => (
                  <div key={b.id}>
                    <p className="font-semibold">{b.label}</p>
                    <ul className="pl-5">
                      {b.positions.map((p) => (
                        <li key={p.id} className="list-disc">
                          <span className="font-mono">{p.label}</span>:{' '}
                          {p.kind === 'fuse'
                            ? `${p.ratingA} A fuse`
                            : `relay, ${p.contactRatingA} A contacts`}
                          {p.feedId != null ? ` for ${feedName.get(p.feedId) ?? '?'}` : ''}
                        </li>
                      ))}
                    </ul>
                  </div>
                ))
              )}
            </div>
          ) : (
            <div role="tabpanel" id={`${id}-feeds`} aria-labelledby={`${id}-feeds-tab`}>
              {snapshot.feeds.length === 0 ? (
                <p className="text-ink-soft">No new feeds were in the plan.</p>
              ) : (
                <div className="overflow-x-auto">
                  <table className="lw-table w-full border-collapse text-sm">
                    <caption className="sr-only">Feeds as frozen</caption>
                    <thead className="border-b border-rule">
                      <tr>
                        <th className="px-2 py-1.5">Feed</th>
                        <th className="px-2 py-1.5">Source</th>
                        <th className="px-2 py-1.5">Fuse</th>
                        <th className="px-2 py-1.5">Relay</th>
                        <th className="px-2 py-1.5">Wire</th>
                        <th className="px-2 py-1.5">Loads</th>
                      </tr>
                    </thead>
                    <tbody>
                      {snapshot.feeds.map((f) => (
                        <tr key={f.id} className="border-b border-rule/60 align-top">
                          <th scope="row" className="px-2 py-1.5 font-semibold">
                            {f.name}
                          </th>
                          <td className="px-2 py-1.5">
                            {f.source === 'relay_output' && f.sourceFeedId != null
                              ? `Relay output of ${feedName.get(f.sourceFeedId) ?? '?'}`
                              : FEED_SOURCE_LABELS[f.source]}
                          </td>
                          <td className="px-2 py-1.5 whitespace-nowrap">
                            {f.fuseA == null ? 'None' : `${f.fuseA} A`}
                          </td>
                          <td className="px-2 py-1.5 whitespace-nowrap">
                            {f.relay ? `${f.relay.contactRatingA} A contacts` : '—'}
                          </td>
                          <td className="px-2 py-1.5">
                            {formatWireSize(f.wire.sizeMm2, unit)}, {f.wire.lengthM} m,{' '}
                            {WIRE_ZONE_LABELS[f.wire.zone].toLowerCase()}
                            {f.wire.colour ? (
                              <>
                                , <WireColour value={f.wire.colour} />
                              </>
                            ) : null}
                          </td>
                          <td className="px-2 py-1.5">
                            <ul>
                              {f.loads.map((l) => (
                                <li key={l.id}>
                                  {l.pinId != null ? (
                                    <span className="font-mono">{names.get(l.pinId) ?? '?'}</span>
                                  ) : null}
                                  {l.pinId != null && l.name ? ' · ' : ''}
                                  {l.name} ({l.currentA} A{l.continuous ? ', continuous' : ''})
                                </li>
                              ))}
                            </ul>
                          </td>
                        </tr>
                      ))}
                    </tbody>
                  </table>
                </div>
              )}
            </div>
          )}
        </>
      ) : null}
    </section>
  );
}
