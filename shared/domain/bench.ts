/**
 * The bench checklist: everything a technician builds from a signed-off revision, in the order it
 * is worked, with only the ticks that make sense for each item, and how bench work carries over
 * when a newer revision is signed off.
 */
import canonicalize from 'canonicalize';
import type { BenchTick, BenchTickDef } from '../schemas/bench.schema.ts';
import type { ConversionSnapshot, SnapshotFeed, SnapshotPin } from '../schemas/snapshot.schema.ts';
import { BENCH_ORDER, DISPOSITION_INFO, type Disposition } from './dispositions.ts';
import { conductorResistanceOhm } from './electrical/copper.ts';
import { FUSE_FAMILIES } from './electrical/fuses.ts';
import { HarnessGraph } from './harness/circuit-graph.ts';
import { pinNames } from './pin-names.ts';
import { sha256Hex } from './revisions/content-hash.ts';

/** Contact and terminal allowance on top of the wire itself (common practice, no source: ≈0–0.2 Ω for short runs). */
export const CONTINUITY_ALLOWANCE_OHM = 0.2;

/** The bench is at workshop temperature; the checks' hot-conductor figures do not apply here. */
export const BENCH_TEMP_C = 20;

export function expectedContinuityOhm(
  run: { sizeMm2: number | null; runLengthM: number | null },
  conductorTempC = BENCH_TEMP_C,
): number | null {
  if (run.sizeMm2 == null || run.runLengthM == null || run.runLengthM <= 0) return null;
  return conductorResistanceOhm({ areaMm2: run.sizeMm2, lengthM: run.runLengthM, conductorTempC });
}

/** The pass limit of a continuity reading: the wire's own resistance plus the allowance. */
export function continuityLimitOhm(expectedOhm: number | null): number {
  return (expectedOhm ?? 0) + CONTINUITY_ALLOWANCE_OHM;
}

/** A reading above the wire's own resistance plus the allowance needs a second look. */
export function continuityLooksHigh(measuredOhm: number, expectedOhm: number | null): boolean {
  return measuredOhm > continuityLimitOhm(expectedOhm);
}

const tick = (key: BenchTick, label: string): BenchTickDef => ({ key, label });

/** What the bench does to a pin, and the ticks that make sense for it. No reading for a wire that goes. */
const PIN_TICKS: Record<Exclude<Disposition, 'empty' | 'undecided'>, BenchTickDef[]> = {
  depin: [tick('done', 'Terminal out'), tick('sealed', 'Cavity sealed/plugged')],
  cut: [tick('done', 'Cut back'), tick('insulated', 'End insulated')],
  extend: [tick('done', 'Extended'), tick('tested', 'Tested')],
  join: [tick('done', 'Joined'), tick('tested', 'Tested')],
  keep: [tick('done', 'In place'), tick('tested', 'Tested')],
};

/** Ticks for an item that was built on an earlier revision and is gone from this one. */
export const REMOVED_TICKS: BenchTickDef[] = [tick('done', 'Taken out')];

export type BenchItemKind = 'pin' | 'feed' | 'wire' | 'splice' | 'ground' | 'box';

/** The words the checklist uses for each kind of item. */
export const BENCH_KIND_LABELS: Record<BenchItemKind, string> = {
  pin: 'Pin',
  feed: 'New feed',
  wire: 'Wire',
  splice: 'Splice',
  ground: 'Ground point',
  box: 'Box position',
};

/** One thing to build on the bench, without what was recorded against it. */
export interface BenchPlanItem {
  /** Stable across revisions: the cavity name for a pin ("pin:E1-12"), the feed's id for a feed. */
  key: string;
  kind: BenchItemKind;
  name: string;
  /** What is asked, in words, e.g. "Join to vehicle circuit · BU/WH 0.5 mm² → Feed: ECU main". */
  asked: string;
  pin: SnapshotPin | null;
  feed: SnapshotFeed | null;
  destinationLabel: string;
  ticks: BenchTickDef[];
  /** A continuity reading is offered: the wire's expected resistance and the pass limit, Ω. */
  reading: { expectedOhm: number | null; limitOhm: number } | null;
  /** The row's content, canonical JSON: the same text in two revisions means the same work. */
  content: string;
}

export const pinKey = (cavityName: string) => `pin:${cavityName}`;
export const feedKey = (feedId: number) => `feed:${feedId}`;

function sizeText(sizeMm2: number | null) {
  return sizeMm2 == null ? '' : `${sizeMm2} mm²`;
}

function canonical(value: unknown): string {
  const text = canonicalize(value);
  if (text === undefined) throw new Error('bench row cannot be serialised');
  return text;
}

function pinItem(pin: SnapshotPin, name: string, destinationLabel: string): BenchPlanItem | null {
  if (pin.disposition === 'empty' || pin.disposition === 'undecided') return null;
  const info = DISPOSITION_INFO[pin.disposition];
  const goes = pin.disposition === 'depin' || pin.disposition === 'cut';
  const wire = [pin.colour, sizeText(pin.sizeMm2)].filter(Boolean).join(' ');
  const asked = [
    info.label,
    goes ? '' : wire,
    goes ? '' : pin.runLengthM != null ? `${pin.runLengthM} m` : '',
    !goes && destinationLabel ? `→ ${destinationLabel}` : '',
  ]
    .filter(Boolean)
    .join(' · ');
  const expectedOhm = goes ? null : expectedContinuityOhm(pin);
  // Ids and list positions are bookkeeping; what the technician builds is named by cavity and
  // destination, so a renumbered row with the same content is the same work.
  const { id: _id, connectorId: _c, conversionId: _v, position: _p, ...fields } = pin;
  return {
    key: pinKey(name),
    kind: 'pin',
    name,
    asked,
    pin,
    feed: null,
    destinationLabel,
    ticks: PIN_TICKS[pin.disposition],
    reading: goes ? null : { expectedOhm, limitOhm: continuityLimitOhm(expectedOhm) },
    content: canonical({
      kind: 'pin',
      name,
      ...fields,
      destinationPinId: null,
      destinationFeedId: null,
      destination: destinationLabel,
    }),
  };
}

function feedItem(
  feed: SnapshotFeed,
  pinName: Map<number, string>,
  feedName: Map<number, string>,
): BenchPlanItem {
  const ticks = [tick('done', 'Wired')];
  if (feed.fuseA != null) ticks.push(tick('fuse', `Fuse fitted, ${feed.fuseA} A`));
  if (feed.relay) ticks.push(tick('relay', 'Relay fitted'));
  ticks.push(tick('tested', 'Tested'));
  const expectedOhm = expectedContinuityOhm({
    sizeMm2: feed.wire.sizeMm2,
    runLengthM: feed.wire.lengthM,
  });
  const loads = feed.loads.map((l) => (l.pinId != null ? (pinName.get(l.pinId) ?? '?') : l.name));
  const asked = [
    feed.fuseA != null ? `${feed.fuseA} A fuse` : 'no fuse',
    feed.relay ? 'relay' : '',
    `${[feed.wire.colour, sizeText(feed.wire.sizeMm2)].filter(Boolean).join(' ')} ${feed.wire.lengthM} m`,
    loads.length ? `→ ${loads.join(', ')}` : '',
  ]
    .filter(Boolean)
    .join(' · ');
  const { id: _id, conversionId: _c, ...fields } = feed;
  return {
    key: feedKey(feed.id),
    kind: 'feed',
    name: `Feed: ${feed.name}`,
    asked,
    pin: null,
    feed,
    destinationLabel: loads.join(', '),
    ticks,
    reading: { expectedOhm, limitOhm: continuityLimitOhm(expectedOhm) },
    content: canonical({
      kind: 'feed',
      ...fields,
      sourceFeed: feed.sourceFeedId != null ? (feedName.get(feed.sourceFeedId) ?? '?') : null,
      sourceFeedId: null,
      relay: feed.relay
        ? {
            ...feed.relay,
            coilPinId: null,
            coilPin:
              feed.relay.coilPinId != null ? (pinName.get(feed.relay.coilPinId) ?? '?') : null,
          }
        : null,
      loads: feed.loads.map(({ id: _l, pinId, ...l }) => ({
        ...l,
        pin: pinId != null ? (pinName.get(pinId) ?? '?') : null,
      })),
    }),
  };
}

/**
 * The harness as bench items: each wire (both ends terminated, labelled, tested end to end), each
 * splice (made, sealed), each ground point (cleaned, torqued) and each box position (fuse or relay
 * fitted). Named by label, so the same wire in two revisions is the same work.
 */
function harnessItems(snapshot: ConversionSnapshot): BenchPlanItem[] {
  const harness = snapshot.harness;
  if (!harness) return [];
  const graph = new HarnessGraph(snapshot, harness);
  const endName = (wire: (typeof harness.wires)[number], i: number) => {
    const end = wire.ends[i]!;
    const node = graph.describe(
      end.kind === 'unresolved'
        ? `unresolved:${wire.id}:${i}`
        : end.kind === 'source'
          ? `source:${end.source}`
          : `${end.kind}:${end.refId}`,
    );
    const terminal = end.kind === 'relay' || end.kind === 'fuse' ? ` ${end.terminal}` : '';
    return end.kind === 'unresolved' ? `? ${node.lines[0] ?? ''}` : `${node.title}${terminal}`;
  };
  const items: BenchPlanItem[] = [];
  for (const w of harness.wires) {
    const [a, b] = [endName(w, 0), endName(w, 1)];
    const expectedOhm = expectedContinuityOhm({ sizeMm2: w.sizeMm2, runLengthM: w.lengthM });
    const { id: _id, conversionId: _c, ends: _e, ...fields } = w;
    items.push({
      key: `wire:${w.label}`,
      kind: 'wire',
      name: w.label,
      asked: [
        [w.colour, sizeText(w.sizeMm2)].filter(Boolean).join(' '),
        w.lengthM != null ? `${w.lengthM} m` : '',
        `${a} → ${b}`,
      ]
        .filter(Boolean)
        .join(' · '),
      pin: null,
      feed: null,
      destinationLabel: `${a} → ${b}`,
      ticks: [
        tick('done', 'Both ends terminated'),
        tick('labelled', 'Labelled at both ends'),
        tick('tested', 'Tested'),
      ],
      reading: { expectedOhm, limitOhm: continuityLimitOhm(expectedOhm) },
      content: canonical({ kind: 'wire', ...fields, endA: a, endB: b }),
    });
  }
  for (const s of harness.splices) {
    const wires = harness.wires
      .filter((w) => w.ends.some((e) => e.kind === 'splice' && e.refId === s.id))
      .map((w) => w.label);
    items.push({
      key: `splice:${s.label}`,
      kind: 'splice',
      name: s.label,
      asked: [`joins ${wires.join(', ') || 'no wires yet'}`, s.branch, s.notes]
        .filter(Boolean)
        .join(' · '),
      pin: null,
      feed: null,
      destinationLabel: '',
      ticks: [tick('done', 'Made'), ...(s.sealed ? [tick('sealed', 'Sealed')] : [])],
      reading: null,
      content: canonical({ kind: 'splice', label: s.label, sealed: s.sealed, wires }),
    });
  }
  for (const g of harness.groundPoints) {
    const wires = harness.wires
      .filter((w) => w.ends.some((e) => e.kind === 'ground' && e.refId === g.id))
      .map((w) => w.label);
    items.push({
      key: `ground:${g.label}`,
      kind: 'ground',
      name: g.label,
      asked: [g.location.replace('_', ' '), `takes ${wires.join(', ') || 'no wires yet'}`, g.notes]
        .filter(Boolean)
        .join(' · '),
      pin: null,
      feed: null,
      destinationLabel: '',
      ticks: [tick('done', 'Cleaned to bare metal'), tick('torqued', 'Fastened and torqued')],
      reading: null,
      content: canonical({ kind: 'ground', label: g.label, location: g.location, wires }),
    });
  }
  for (const box of harness.boxes) {
    for (const p of box.positions) {
      const fitted =
        p.kind === 'fuse'
          ? tick('fuse', `Fuse fitted, ${p.ratingA} A`)
          : tick('relay', `Relay fitted, contacts ${p.contactRatingA} A`);
      const { id: _id, feedId: _f, ...fields } = p;
      items.push({
        key: `box:${box.label}:${p.label}`,
        kind: 'box',
        name: `${box.label} ${p.label}`,
        asked:
          p.kind === 'fuse'
            ? `${FUSE_FAMILIES[p.fuseType].label} ${p.ratingA} A`
            : `Relay, contacts ${p.contactRatingA} A`,
        pin: null,
        feed: null,
        destinationLabel: '',
        ticks: [fitted],
        reading: null,
        content: canonical({ item: 'box', box: box.label, ...fields }),
      });
    }
  }
  return items;
}

/**
 * Every pin with something to do (empty cavities left out) in bench order, then every new feed,
 * then the harness: wires, splices, ground points and box positions.
 */
export function benchPlanItems(snapshot: ConversionSnapshot): BenchPlanItem[] {
  const pinName = pinNames(snapshot);
  const feedName = new Map(snapshot.feeds.map((f) => [f.id, f.name]));
  const connectorOrder = new Map(snapshot.connectors.map((c, i) => [c.id, i]));
  const pins = [...snapshot.pins]
    .sort(
      (a, b) =>
        BENCH_ORDER.indexOf(a.disposition) - BENCH_ORDER.indexOf(b.disposition) ||
        connectorOrder.get(a.connectorId)! - connectorOrder.get(b.connectorId)! ||
        a.position - b.position,
    )
    .map((pin) =>
      pinItem(
        pin,
        pinName.get(pin.id)!,
        pin.destinationPinId != null
          ? (pinName.get(pin.destinationPinId) ?? '')
          : pin.destinationFeedId != null
            ? `Feed: ${feedName.get(pin.destinationFeedId) ?? '?'}`
            : pin.destination,
      ),
    )
    .filter((i): i is BenchPlanItem => i !== null);
  return [
    ...pins,
    ...snapshot.feeds.map((f) => feedItem(f, pinName, feedName)),
    ...harnessItems(snapshot),
  ];
}

/** SHA-256 of an item's canonical content: the "same row" test across revisions. */
export const rowHash = (item: Pick<BenchPlanItem, 'content'>) => sha256Hex(item.content);

/** The ticks of a record that count for this item: unknown or meaningless ticks are left out. */
export function offeredTicks(
  item: Pick<BenchPlanItem, 'ticks'>,
  ticks: Partial<Record<BenchTick, boolean>>,
): Partial<Record<BenchTick, boolean>> {
  return Object.fromEntries(item.ticks.map((t) => [t.key, ticks[t.key] === true]));
}

/** Built: every tick but "tested" is on. */
export function isDone(
  item: Pick<BenchPlanItem, 'ticks'>,
  ticks: Partial<Record<BenchTick, boolean>> | undefined,
): boolean {
  const work = item.ticks.filter((t) => t.key !== 'tested');
  return work.length > 0 && work.every((t) => ticks?.[t.key] === true);
}

export function isTested(
  item: Pick<BenchPlanItem, 'ticks'>,
  ticks: Partial<Record<BenchTick, boolean>> | undefined,
): boolean {
  return item.ticks.some((t) => t.key === 'tested') && ticks?.tested === true;
}

/** "cut back, end insulated" — what a record says was done on an item. */
export function workDone(
  item: Pick<BenchPlanItem, 'ticks'>,
  ticks: Partial<Record<BenchTick, boolean>>,
): string {
  const on = item.ticks.filter((t) => ticks[t.key]).map((t) => t.label.toLowerCase());
  return on.length ? on.join(', ') : 'nothing ticked';
}

/** A record as carry-over sees it: its item key, ticks, reading and note. */
export interface CarryRecord {
  key: string;
  ticks: Partial<Record<BenchTick, boolean>>;
  reading: number | null;
  note: string;
  /** Rework still owed from an earlier revision, carried along until it is done. */
  rework: Rework | null;
}

export interface Rework {
  fromRevision: number;
  /** The item's name in that revision. */
  name: string;
  /** What the older revision asked and what was done: "Cut and insulate (cut back, end insulated)". */
  was: string;
  /** The item is no longer in the plan: whatever was built must come out. */
  removed: boolean;
}

export interface CarryOutcome {
  /** Unchanged items: the old record carries over as it is. */
  carried: CarryRecord[];
  /** Changed items that had work done: listed first, with nothing ticked, until re-done. */
  rework: Array<{ key: string; rework: Rework }>;
  /** Items gone from the plan that had work done: to be taken out. */
  removed: Array<{ key: string; rework: Rework }>;
  /** Items new in this revision: nothing to carry. */
  added: string[];
}

/**
 * What becomes of bench work when revision `toRevision` is signed off after `fromRevision`: a
 * record carries where the item is unchanged (same key, same content hash); work on a changed or
 * removed item becomes rework that says what was done and must be re-ticked. Records without any
 * work (no tick, no reading) are not worth carrying as rework.
 */
export async function carryOver(
  from: { number: number; items: BenchPlanItem[]; records: CarryRecord[] },
  to: { items: BenchPlanItem[] },
): Promise<CarryOutcome> {
  const oldItems = new Map(from.items.map((i) => [i.key, i]));
  const newItems = new Map(to.items.map((i) => [i.key, i]));
  const outcome: CarryOutcome = { carried: [], rework: [], removed: [], added: [] };
  for (const record of from.records) {
    const oldItem = oldItems.get(record.key);
    const newItem = newItems.get(record.key);
    if (!oldItem) {
      // Something removed earlier and not yet taken out stays on the list until it is.
      if (record.rework?.removed && !record.ticks.done && !newItem) {
        outcome.removed.push({ key: record.key, rework: record.rework });
      }
      continue;
    }
    const worked = Object.values(record.ticks).some(Boolean) || record.reading != null;
    if (newItem && (await rowHash(oldItem)) === (await rowHash(newItem))) {
      // Rework once re-done is ordinary work from here on.
      const settled = record.rework && !record.rework.removed && isDone(newItem, record.ticks);
      outcome.carried.push(settled ? { ...record, rework: null } : record);
      continue;
    }
    if (!worked) {
      // Changed again before the rework was done: what is physically there is still the old work.
      if (record.rework) {
        const owed = { ...record.rework, removed: !newItem };
        if (newItem) outcome.rework.push({ key: record.key, rework: owed });
        else outcome.removed.push({ key: record.key, rework: owed });
      }
      continue;
    }
    const rework: Rework = {
      fromRevision: from.number,
      name: oldItem.name,
      was: `${oldItem.asked} (${workDone(oldItem, record.ticks)})`,
      removed: !newItem,
    };
    if (newItem) outcome.rework.push({ key: record.key, rework });
    else outcome.removed.push({ key: record.key, rework });
  }
  outcome.added = to.items.filter((i) => !oldItems.has(i.key)).map((i) => i.key);
  return outcome;
}
