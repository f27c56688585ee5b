import { fieldLabels, showField } from '#shared/domain/fields/field-table.ts';
import { PIN_FIELDS } from '#shared/domain/fields/pin-fields.ts';
import { countChanges } from '#shared/domain/revisions/diff.ts';
import { formatWireSize } from '#shared/domain/wire-sizes.ts';
import {
  RETURN_PATH_LABELS,
  WIRE_ZONE_LABELS,
  type FeedWire,
} from '#shared/schemas/feeds.schema.ts';
import type { PinFields } from '#shared/schemas/pin-map.schema.ts';
import type { FieldChange, RevisionChanges } from '#shared/schemas/revisions.schema.ts';
import type { SizeUnit } from '#shared/schemas/workshop.schema.ts';

/** Pin fields by the pin field table; a feed's, a connector's and a conversion's by name. */
const FIELD_LABELS: Record<string, string> = {
  ...fieldLabels(PIN_FIELDS),
  fuseA: 'Fuse',
  relay: 'Relay',
  wire: 'Wire',
  loads: 'Loads',
  dropClass: 'Drop class',
  dropLimitPct: 'Drop limit',
  source: 'Source',
  sourceFeedId: 'Source feed',
  name: 'Name',
  donorEngine: 'Donor engine',
  receivingVehicle: 'Receiving vehicle',
  systemVoltage: 'System voltage',
  side: 'Side',
  cavityCount: 'Cavities',
  rows: 'Rows',
  columns: 'Columns',
};

/** Links arrive named ("V1-3", a feed's name) rather than as ids: shown as they come. */
const LINK_FIELDS: ReadonlySet<string> = new Set(['destinationPinId', 'destinationFeedId']);
const isPinField = (field: string): field is keyof PinFields =>
  Object.hasOwn(PIN_FIELDS, field) && !LINK_FIELDS.has(field);

function show(field: string, value: unknown, unit: SizeUnit): string {
  if (value === null || value === undefined || value === '') return '—';
  if (isPinField(field)) return showField(PIN_FIELDS, field, value as never, unit) || '—';
  if (field === 'fuseA') return `${String(value)} A`;
  if (field === 'wire' && typeof value === 'object') {
    const w = value as FeedWire;
    return `${formatWireSize(w.sizeMm2, unit)}, ${w.lengthM} m, ${WIRE_ZONE_LABELS[w.zone].toLowerCase()}, ${RETURN_PATH_LABELS[w.returnPath].toLowerCase()}${w.colour ? `, ${w.colour}` : ''}`;
  }
  if (typeof value === 'object') return JSON.stringify(value);
  return String(value);
}

function ChangeRows({
  subject,
  fields,
  unit,
}: {
  subject: string;
  fields: FieldChange[];
  unit: SizeUnit;
}) {
  return (
    <>
      {fields.map((f, i) => (
        <tr key={f.field} className="border-b border-rule/60 align-top">
          <th scope="row" className="px-3 py-2 font-mono text-sm font-semibold">
            {i === 0 ? subject : ''}
          </th>
          <td className="px-3 py-2 text-sm text-ink-soft">{FIELD_LABELS[f.field] ?? f.field}</td>
          <td className="px-3 py-2 text-sm">
            <del className="text-ink-faint decoration-fault/60">
              {show(f.field, f.before, unit)}
            </del>
          </td>
          <td className="px-3 py-2 text-sm">
            <ins className="no-underline font-medium">{show(f.field, f.after, unit)}</ins>
          </td>
        </tr>
      ))}
    </>
  );
}

function NameList({ label, glyph, names }: { label: string; glyph: string; names: string[] }) {
  if (!names.length) return null;
  return (
    <p className="text-sm">
      <span className="font-semibold">
        <span aria-hidden>{glyph} </span>
        {label}:
      </span>{' '}
      <span className="font-mono">{names.join(', ')}</span>
    </p>
  );
}

/** Field-by-field differences from the last signed-off revision. */
export function ChangesView({
  changes,
  comparedWith,
  unit,
}: {
  changes: RevisionChanges;
  comparedWith: number;
  unit: SizeUnit;
}) {
  const rows = [
    ...changes.conversion.map((f) => ({ subject: 'Conversion', fields: [f] })),
    ...changes.connectors.changed.map((c) => ({
      subject: `Connector ${c.label}`,
      fields: c.fields,
    })),
    ...changes.pins.changed.map((p) => ({ subject: p.name, fields: p.fields })),
    ...changes.feeds.changed.map((f) => ({ subject: `Feed: ${f.name}`, fields: f.fields })),
  ];
  return (
    <section
      aria-labelledby="changes-heading"
      className="rounded-lg border border-rule bg-paper-raised p-5"
    >
      <h2 id="changes-heading" className="text-lg font-semibold">
        Changes since revision {comparedWith}
      </h2>
      {countChanges(changes) === 0 ? <p className="mt-2 text-ink-soft">Nothing changed.</p> : null}
      <div className="mt-2 flex flex-col gap-1">
        <NameList label="Connectors added" glyph="+" names={changes.connectors.added} />
        <NameList label="Connectors removed" glyph="−" names={changes.connectors.removed} />
        <NameList label="Pins added" glyph="+" names={changes.pins.added.map((p) => p.name)} />
        <NameList label="Pins removed" glyph="−" names={changes.pins.removed.map((p) => p.name)} />
        <NameList label="Feeds added" glyph="+" names={changes.feeds.added.map((f) => f.name)} />
        <NameList
          label="Feeds removed"
          glyph="−"
          names={changes.feeds.removed.map((f) => f.name)}
        />
      </div>
      {rows.length ? (
        <table className="lw-table mt-3 w-full border-collapse">
          <caption className="sr-only">Changed fields</caption>
          <thead className="border-b border-rule">
            <tr>
              <th className="px-3 py-2">What</th>
              <th className="px-3 py-2">Field</th>
              <th className="px-3 py-2">Was</th>
              <th className="px-3 py-2">Now</th>
            </tr>
          </thead>
          <tbody>
            {rows.map((r, i) => (
              <ChangeRows key={i} subject={r.subject} fields={r.fields} unit={unit} />
            ))}
          </tbody>
        </table>
      ) : null}
    </section>
  );
}
