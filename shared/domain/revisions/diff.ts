/**
 * What changed between two snapshots of a conversion: pins matched by connector label and cavity
 * (what a person calls them), feeds by id with their name, connectors by label; field by field.
 */
import { PIN_FIELD_NAMES } from '../../schemas/pin-map.schema.ts';
import type { FieldChange, RevisionChanges } from '../../schemas/revisions.schema.ts';
import type { SnapshotHarness } from '../../schemas/harness.schema.ts';
import type {
  ConversionSnapshot,
  SnapshotFeed,
  SnapshotPin,
} from '../../schemas/snapshot.schema.ts';

type SnapshotWire = SnapshotHarness['wires'][number];
import { pinNames } from '../pin-names.ts';

/** Every field a person sets on a pin. */
const PIN_FIELDS: Array<keyof SnapshotPin> = PIN_FIELD_NAMES;

function same(a: unknown, b: unknown): boolean {
  return JSON.stringify(a) === JSON.stringify(b);
}

function fieldChanges<T extends object>(
  before: T,
  after: T,
  fields: Array<keyof T>,
): FieldChange[] {
  return fields
    .filter((f) => !same(before[f], after[f]))
    .map((f) => ({ field: String(f), before: before[f], after: after[f] }));
}

function pinsByName(s: ConversionSnapshot): Map<string, SnapshotPin> {
  const names = pinNames(s);
  return new Map(s.pins.map((p) => [names.get(p.id)!, p]));
}

/** Linked destinations compare by the name of what they point at, not by database id. */
function describePinLinks(s: ConversionSnapshot) {
  const pinName = pinNames(s);
  const feedName = new Map(s.feeds.map((f) => [f.id, f.name]));
  return (p: SnapshotPin) => ({
    ...p,
    destinationPinId:
      p.destinationPinId == null ? null : (pinName.get(p.destinationPinId) ?? p.destinationPinId),
    destinationFeedId:
      p.destinationFeedId == null
        ? null
        : (feedName.get(p.destinationFeedId) ?? p.destinationFeedId),
  });
}

function comparableFeed(f: SnapshotFeed) {
  return {
    name: f.name,
    source: f.source,
    sourceFeedId: f.sourceFeedId,
    fuseA: f.fuseA,
    relay: f.relay,
    wire: f.wire,
    loads: f.loads.map(({ id: _id, ...l }) => l),
    dropClass: f.dropClass,
    dropLimitPct: f.dropLimitPct,
    notes: f.notes,
  };
}

const SIDE_WORDS: Record<string, string> = {
  ecu: 'ECU side',
  engine: 'engine side',
  vehicle: 'vehicle side',
  other: 'other',
};

/** A pin as the differences name it: cavity name, function and connector. */
function pinRef(s: ConversionSnapshot) {
  const connectors = new Map(s.connectors.map((c) => [c.id, c]));
  return (name: string, pin: SnapshotPin) => {
    const c = connectors.get(pin.connectorId);
    return {
      name,
      pinId: pin.id,
      function: pin.function,
      connector: c ? `${c.label}, ${SIDE_WORDS[c.side] ?? c.side}` : '?',
    };
  };
}

export function diffSnapshots(
  before: ConversionSnapshot,
  after: ConversionSnapshot,
): RevisionChanges {
  const oldPins = pinsByName(before);
  const newPins = pinsByName(after);
  const describeOld = describePinLinks(before);
  const describeNew = describePinLinks(after);
  const oldRef = pinRef(before);
  const newRef = pinRef(after);
  const pins: RevisionChanges['pins'] = { added: [], removed: [], changed: [] };
  for (const [name, pin] of newPins) {
    const old = oldPins.get(name);
    if (!old) {
      pins.added.push(newRef(name, pin));
      continue;
    }
    const fields = fieldChanges(describeOld(old), describeNew(pin), PIN_FIELDS);
    if (fields.length) pins.changed.push({ ...newRef(name, pin), fields });
  }
  for (const [name, pin] of oldPins) if (!newPins.has(name)) pins.removed.push(oldRef(name, pin));

  const oldFeeds = new Map(before.feeds.map((f) => [f.id, f]));
  const newFeeds = new Map(after.feeds.map((f) => [f.id, f]));
  const feeds: RevisionChanges['feeds'] = { added: [], removed: [], changed: [] };
  for (const [id, feed] of newFeeds) {
    const old = oldFeeds.get(id);
    if (!old) {
      feeds.added.push({ name: feed.name, feedId: id });
      continue;
    }
    const a = comparableFeed(old);
    const b = comparableFeed(feed);
    const fields = fieldChanges(a, b, Object.keys(b) as Array<keyof typeof b>);
    if (fields.length) feeds.changed.push({ name: feed.name, feedId: id, fields });
  }
  for (const [id, feed] of oldFeeds)
    if (!newFeeds.has(id)) feeds.removed.push({ name: feed.name, feedId: id });

  const oldConnectors = new Map(before.connectors.map((c) => [c.label, c]));
  const newConnectors = new Map(after.connectors.map((c) => [c.label, c]));
  const connectors: RevisionChanges['connectors'] = { added: [], removed: [], changed: [] };
  for (const [label, c] of newConnectors) {
    const old = oldConnectors.get(label);
    if (!old) connectors.added.push(label);
    else {
      const fields = fieldChanges(old, c, ['side', 'cavityCount', 'rows', 'columns', 'notes']);
      if (fields.length) connectors.changed.push({ label, fields });
    }
  }
  for (const label of oldConnectors.keys())
    if (!newConnectors.has(label)) connectors.removed.push(label);

  const conversion = fieldChanges(before.conversion, after.conversion, [
    'name',
    'donorEngine',
    'receivingVehicle',
    'systemVoltage',
    'notes',
  ]);
  return { pins, feeds, connectors, conversion, harness: diffHarness(before, after) };
}

/** How a wire end is named in the differences and the frozen plan: "E1-5", "S-03", "Box F4:in". */
export function harnessEndNamer(
  s: ConversionSnapshot,
): (e: SnapshotWire['ends'][number]) => string {
  const h = s.harness;
  const pinName = pinNames(s);
  const positionName = new Map(
    (h?.boxes ?? []).flatMap((b) =>
      b.positions.map((p) => [p.id, `${b.label} ${p.label}`] as const),
    ),
  );
  return (e) => {
    switch (e.kind) {
      case 'pin':
        return pinName.get(e.refId) ?? `pin ${e.refId}`;
      case 'splice':
        return h?.splices.find((x) => x.id === e.refId)?.label ?? 'splice';
      case 'ground':
        return h?.groundPoints.find((x) => x.id === e.refId)?.label ?? 'ground';
      case 'relay':
      case 'fuse':
        return `${positionName.get(e.refId) ?? e.kind}:${e.terminal}`;
      case 'source':
        return e.source;
      case 'unresolved':
        return `? ${e.text}`;
    }
  };
}

/** Every harness item by what a person calls it ("W-012", "S-03", "G-1", "Fuse and relay box F4"). */
function harnessItems(s: ConversionSnapshot): Map<string, Record<string, unknown>> {
  const items = new Map<string, Record<string, unknown>>();
  const h = s.harness;
  if (!h) return items;
  const endName = harnessEndNamer(s);
  for (const w of h.wires) {
    items.set(`Wire ${w.label}`, {
      colour: w.colour,
      sizeMm2: w.sizeMm2,
      lengthM: w.lengthM,
      zone: w.zone,
      endA: endName(w.ends[0]),
      endB: endName(w.ends[1]),
      notes: w.notes,
      twistGroup: w.twistGroup ?? '',
      shielded: w.shielded ?? false,
    });
  }
  for (const x of h.splices)
    items.set(`Splice ${x.label}`, {
      sealed: x.sealed,
      branch: x.branch,
      distanceMm: x.distanceMm,
      notes: x.notes,
    });
  for (const g of h.groundPoints)
    items.set(`Ground point ${g.label}`, {
      location: g.location,
      strapSizeMm2: g.strapSizeMm2,
      notes: g.notes,
    });
  for (const b of h.boxes) {
    for (const { id: _id, ...p } of b.positions) items.set(`${b.label} ${p.label}`, { ...p });
  }
  return items;
}

function diffHarness(
  before: ConversionSnapshot,
  after: ConversionSnapshot,
): RevisionChanges['harness'] {
  const old = harnessItems(before);
  const now = harnessItems(after);
  const changes: NonNullable<RevisionChanges['harness']> = { added: [], removed: [], changed: [] };
  for (const [label, item] of now) {
    const was = old.get(label);
    if (!was) changes.added.push(label);
    else {
      const fields = fieldChanges(was, item, Object.keys(item));
      if (fields.length) changes.changed.push({ label, fields });
    }
  }
  for (const label of old.keys()) if (!now.has(label)) changes.removed.push(label);
  return changes;
}

export function countChanges(c: RevisionChanges): number {
  return (
    c.pins.added.length +
    c.pins.removed.length +
    c.pins.changed.length +
    c.feeds.added.length +
    c.feeds.removed.length +
    c.feeds.changed.length +
    c.connectors.added.length +
    c.connectors.removed.length +
    c.connectors.changed.length +
    c.conversion.length +
    (c.harness ? c.harness.added.length + c.harness.removed.length + c.harness.changed.length : 0)
  );
}
