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
import type {
  ChangedPinRef,
  FieldChange,
  RevisionChanges,
} from '#shared/schemas/revisions.schema.ts';
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
  twistGroup: 'Twist group',
  shielded: 'Shielded',
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
  if (typeof value === 'boolean') return value ? 'yes' : 'no';
  if (typeof value === 'object') return JSON.stringify(value);
  return String(value);
}

interface Subject {
  name: string;
  /** What the thing is, beside its name: a pin's function and connector. */
  detail?: string;
}

function SubjectCell({ subject }: { subject: Subject }) {
  return (
    <>
      <span className="font-mono font-semibold">{subject.name}</span>
      {subject.detail ? (
        <span className="block text-xs font-normal text-ink-soft">{subject.detail}</span>
      ) : null}
    </>
  );
}

function ChangeRows({
  subject,
  fields,
  unit,
}: {
  subject: Subject;
  fields: FieldChange[];
  unit: SizeUnit;
}) {
  return (
    <>
      {fields.map((f, i) => (
        <tr key={f.field} className="border-b border-rule/60 align-top">
          <th scope="row" className="px-3 py-2 text-sm">
            {i === 0 ? <SubjectCell subject={subject} /> : ''}
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

const pinSubject = (p: ChangedPinRef): Subject => ({
  name: p.name,
  detail: `${p.function || 'no function'} · connector ${p.connector}`,
});

function SubjectList({
  id,
  title,
  glyph,
  items,
}: {
  id: string;
  title: string;
  glyph: string;
  items: Subject[];
}) {
  if (!items.length) return null;
  return (
    <section aria-labelledby={id} className="flex flex-col gap-1">
      <h3 id={id} className="font-semibold">
        <span aria-hidden>{glyph} </span>
        {title} ({items.length})
      </h3>
      <ul className="flex flex-col gap-1 pl-5">
        {items.map((item, i) => (
          <li key={`${item.name}-${i}`} className="text-sm">
            <SubjectCell subject={item} />
          </li>
        ))}
      </ul>
    </section>
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
  const rows: Array<{ subject: Subject; fields: FieldChange[] }> = [
    ...changes.conversion.map((f) => ({ subject: { name: 'Conversion' }, fields: [f] })),
    ...changes.connectors.changed.map((c) => ({
      subject: { name: `Connector ${c.label}` },
      fields: c.fields,
    })),
    ...changes.pins.changed.map((p) => ({ subject: pinSubject(p), fields: p.fields })),
    ...changes.feeds.changed.map((f) => ({
      subject: { name: `Feed: ${f.name}` },
      fields: f.fields,
    })),
    ...(changes.harness?.changed ?? []).map((h) => ({
      subject: { name: h.label },
      fields: h.fields,
    })),
  ];
  const added: Subject[] = [
    ...changes.connectors.added.map((label) => ({ name: `Connector ${label}` })),
    ...changes.pins.added.map(pinSubject),
    ...changes.feeds.added.map((f) => ({ name: `Feed: ${f.name}` })),
    ...(changes.harness?.added ?? []).map((label) => ({ name: label })),
  ];
  const removed: Subject[] = [
    ...changes.connectors.removed.map((label) => ({ name: `Connector ${label}` })),
    ...changes.pins.removed.map(pinSubject),
    ...changes.feeds.removed.map((f) => ({ name: `Feed: ${f.name}` })),
    ...(changes.harness?.removed ?? []).map((label) => ({ name: label })),
  ];
  return (
    <section
      aria-labelledby="changes-heading"
      className="flex flex-col gap-4 rounded-lg border border-rule bg-paper-raised p-5"
    >
      <h2 id="changes-heading" className="text-lg font-semibold">
        Changes since revision {comparedWith}
      </h2>
      {countChanges(changes) === 0 ? <p className="text-ink-soft">Nothing changed.</p> : null}
      <SubjectList id="changes-added" title="Added" glyph="+" items={added} />
      <SubjectList id="changes-removed" title="Removed" glyph="−" items={removed} />
      {rows.length ? (
        <section aria-labelledby="changes-changed" className="flex flex-col gap-1">
          <h3 id="changes-changed" className="font-semibold">
            <span aria-hidden>~ </span>Changed ({rows.length})
          </h3>
          <table className="lw-table w-full border-collapse">
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
        </section>
      ) : null}
    </section>
  );
}
