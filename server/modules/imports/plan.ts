/**
 * What an import would do to the pin map, worked out from the checked rows and a snapshot of the
 * conversion, without touching the database. The preview shows this plan; applying writes exactly
 * this plan, recomputed inside the write transaction.
 *
 * Semantics for a connector the file names (docs/decisions/0005-pinout-import-and-file-storage.md):
 * - a row whose cavity the connector has updates that pin, field by field, in the columns the file
 *   has (a column the file lacks leaves that field alone);
 * - a row for a cavity the connector lacks adds the cavity (the connector grows, its face too),
 *   which applying does only when the person confirmed it (`grow=1`) after the preview named it;
 * - a cavity of the connector that the file does not name is removed if it is blank; if it holds
 *   anything, or other pins or feeds point at it, the import is refused naming those cavities.
 */
import { looseLabelKey } from '#shared/domain/labels.ts';
import { fieldKeys, showField } from '#shared/domain/fields/field-table.ts';
import { PIN_FIELDS } from '#shared/domain/fields/pin-fields.ts';
import { pinNames } from '#shared/domain/pin-names.ts';
import { parseWireColour } from '#shared/domain/wire-colours.ts';
import type {
  FieldChange,
  ImportChange,
  ImportField,
  ImportIssue,
  ImportSummary,
} from '#shared/schemas/imports.schema.ts';
import {
  BLANK_PIN_VALUES,
  defaultFaceLayout,
  MAX_CAVITIES,
  pinHoldsData,
  type ConnectorSide,
  type PinFields,
} from '#shared/schemas/pin-map.schema.ts';
import type { SizeUnit } from '#shared/schemas/workshop.schema.ts';
import type { PinRow } from './rows.ts';

export interface PinData extends PinFields {
  id: number;
  connectorId: number;
  cavity: string;
  position: number;
  version: number;
}

export interface ConnectorData {
  id: number;
  label: string;
  side: ConnectorSide;
  cavityCount: number;
  rows: number;
  columns: number;
}

export interface PlanContext {
  connectors: ConnectorData[];
  /** Every pin of the conversion: targets of destination links are looked up among them. */
  pins: PinData[];
  feeds: Array<{ id: number; name: string }>;
  /** Pins that feeds or other pins point at: never removed by an import. */
  referencedPinIds: ReadonlySet<number>;
  target: { kind: 'connector'; connectorId: number } | { kind: 'conversion' };
  /** The workshop's unit, in which the plan shows sizes; mm² when not given. */
  sizeUnit?: SizeUnit;
}

export interface ConnectorPlan {
  connectorId: number;
  label: string;
  /** New cavities, with their face position. */
  adds: Array<PinFields & { cavity: string; position: number }>;
  /** Existing pins whose fields or face position change; `version` is the new version. */
  updates: PinData[];
  removes: number[];
  cavityCount: number;
  rows: number;
  columns: number;
  /** Cavities added to a connector that already had some (it grows): to be confirmed. */
  grows: { from: number; cavities: string[] } | null;
  /** Whether the cavity count or the face's rows and columns change (the connector is saved). */
  reshaped: boolean;
  /** Whether a pin is joined to a feed, or leaves one, so the feeds' loads must follow. */
  feedLinksMove: boolean;
}

export interface Plan {
  errors: ImportIssue[];
  changes: ImportChange[];
  summary: ImportSummary;
  connectors: ConnectorPlan[];
}

export interface Names {
  pinName: (id: number | null) => string;
  feedName: (id: number | null) => string;
}

/**
 * A plan lists changes in the file's terms: a link to a cavity travels in the destination's column,
 * so the destination and its link are one "Destination"; a joined feed is shown by its name.
 */
const SHOWN_FIELDS = fieldKeys(PIN_FIELDS).filter((key) => key !== 'destinationPinId');

function display(key: keyof PinFields, pin: PinFields, names: Names, unit: SizeUnit): string {
  if (key === 'destination' && pin.destinationPinId != null) {
    return `→ ${names.pinName(pin.destinationPinId)}`;
  }
  if (key === 'destinationFeedId') return names.feedName(pin.destinationFeedId);
  return showField(PIN_FIELDS, key, pin[key], unit);
}

function differs(key: keyof PinFields, before: PinFields, after: PinFields): boolean {
  if (key === 'destination' && before.destinationPinId !== after.destinationPinId) return true;
  return before[key] !== after[key];
}

export function fieldChanges(
  before: PinFields,
  after: PinFields,
  names: Names,
  unit: SizeUnit = 'mm2',
): FieldChange[] {
  return SHOWN_FIELDS.filter((key) => differs(key, before, after)).map((key) => ({
    field: key,
    label: PIN_FIELDS[key].label,
    before: display(key, before, names, unit),
    after: display(key, after, names, unit),
  }));
}

/**
 * A change whose field list (a display string for each changed field) is made when first read:
 * a preview sends one page of a file's changes, and applying sends none, so the strings of a
 * 20,000-line file's other pages are never made.
 */
function withFields<C extends object>(
  change: C,
  make: () => FieldChange[],
): C & { fields: FieldChange[] } {
  let fields: FieldChange[] | undefined;
  return Object.defineProperty(change, 'fields', {
    enumerable: true,
    get: () => (fields ??= make()),
  }) as C & { fields: FieldChange[] };
}

export function makeNames(ctx: Pick<PlanContext, 'connectors' | 'pins' | 'feeds'>): Names {
  const pins = pinNames(ctx);
  const feeds = new Map(ctx.feeds.map((f) => [f.id, f.name]));
  return {
    pinName: (id) => (id == null ? '' : (pins.get(id) ?? '')),
    feedName: (id) => (id == null ? '' : (feeds.get(id) ?? '')),
  };
}

/**
 * Fields a row's value is copied into as read; the colour is compared as a colour, and the
 * destination and feed name links the plan resolves.
 */
const VALUE_FIELDS = fieldKeys(PIN_FIELDS).filter(
  (key) => !['colour', 'destination', 'destinationPinId', 'destinationFeedId'].includes(key),
);

function sameColour(stored: string, imported: string): boolean {
  if (stored === imported) return true;
  const parsed = parseWireColour(stored);
  return parsed.ok && parsed.value === imported;
}

function findByLabel<T extends { label: string }>(items: readonly T[], label: string): T | null {
  const exact = items.find((c) => c.label === label);
  if (exact) return exact;
  const folded = items.filter((c) => looseLabelKey(c.label) === looseLabelKey(label));
  return folded.length === 1 ? folded[0]! : null;
}

/**
 * Works out the plan. `columnOf` names the header of each imported field (for error columns);
 * `mentioned` lists every cavity the file names, including rows that have problems.
 */
export function planImport(...args: PlanArgs): Plan {
  const steps = planInSteps(...args);
  for (;;) {
    const step = steps.next();
    if (step.done) return step.value;
  }
}

/**
 * `planImport`, letting other requests run between connectors: a plan for fifty connectors of a
 * 20,000-line file is a few hundred milliseconds of work.
 */
export async function planImportYielding(...args: PlanArgs): Promise<Plan> {
  const steps = planInSteps(...args);
  for (;;) {
    const step = steps.next();
    if (step.done) return step.value;
    await new Promise<void>((resolve) => setImmediate(resolve));
  }
}

type PlanArgs = [
  ctx: PlanContext,
  rows: readonly PinRow[],
  mentioned: ReadonlyArray<{ connector: string | null; cavity: string }>,
  headerOf: (field: ImportField) => string | null,
  imported: ReadonlySet<ImportField>,
];

function* planInSteps(
  ...[ctx, rows, mentioned, headerOf, imported]: PlanArgs
): Generator<void, Plan> {
  const errors: ImportIssue[] = [];
  const changes: ImportChange[] = [];
  const summary: ImportSummary = { added: 0, changed: 0, unchanged: 0, removed: 0 };
  const names = makeNames(ctx);
  const unit = ctx.sizeUnit ?? 'mm2';

  // Destinations: "V1-3" (any case, optionally after "→") names a vehicle-side cavity.
  const vehicleConnectors = new Set(
    ctx.connectors.filter((c) => c.side === 'vehicle').map((c) => c.id),
  );
  const linkTargets = new Map<string, number | null>();
  for (const pin of ctx.pins) {
    if (!vehicleConnectors.has(pin.connectorId)) continue;
    const key = names.pinName(pin.id).toUpperCase();
    // Two cavities with the same written name (labels with dashes): link neither.
    linkTargets.set(key, linkTargets.has(key) ? null : pin.id);
  }
  const feedsByName = new Map<string, number>();
  for (const feed of ctx.feeds) feedsByName.set(feed.name.trim().toUpperCase(), feed.id);
  const feedList = ctx.feeds.map((f) => f.name).join(', ') || 'none yet';

  // Which connector each row goes to.
  const into = ctx.target;
  const target =
    into.kind === 'connector' ? ctx.connectors.find((c) => c.id === into.connectorId)! : null;
  const routed = new Map<number, PinRow[]>();
  const connectorOf = (label: string | null, row: number | null): ConnectorData | null => {
    if (target) {
      if (label && !findByLabel([target], label)) {
        if (row !== null) {
          errors.push({
            row,
            column: headerOf('connector'),
            message: `This row is for connector "${label}", not ${target.label}. Remove it, or import the file into the whole conversion so rows go to their connectors.`,
          });
        }
        return null;
      }
      return target;
    }
    if (!label) {
      if (row !== null) {
        errors.push({
          row,
          column: headerOf('connector'),
          message: 'is empty: say which connector this cavity is on',
        });
      }
      return null;
    }
    const found = findByLabel(ctx.connectors, label);
    if (!found && row !== null) {
      errors.push({
        row,
        column: headerOf('connector'),
        message: `This conversion has no connector "${label}" (it has ${ctx.connectors.map((c) => c.label).join(', ') || 'none'}). Add it on the pin map first, or correct the label.`,
      });
    }
    return found;
  };
  for (const row of rows) {
    const connector = connectorOf(row.connector, row.row);
    if (!connector) continue;
    const list = routed.get(connector.id) ?? [];
    list.push(row);
    routed.set(connector.id, list);
  }
  const mentionedBy = new Map<number, Set<string>>();
  for (const m of mentioned) {
    const connector = connectorOf(m.connector, null);
    if (!connector) continue;
    const set = mentionedBy.get(connector.id) ?? new Set<string>();
    set.add(looseLabelKey(m.cavity));
    mentionedBy.set(connector.id, set);
  }

  const plans: ConnectorPlan[] = [];
  const pinsBy = new Map<number, PinData[]>();
  for (const pin of ctx.pins) {
    const list = pinsBy.get(pin.connectorId) ?? [];
    list.push(pin);
    pinsBy.set(pin.connectorId, list);
  }

  for (const connector of ctx.connectors) {
    if (plans.length > 0) yield;
    const fileRows = routed.get(connector.id);
    const named = mentionedBy.get(connector.id);
    if (!fileRows && !named) continue;
    const existing = [...(pinsBy.get(connector.id) ?? [])].sort((a, b) => a.position - b.position);
    const byCavity = new Map(existing.map((p) => [p.cavity, p]));
    const byFolded = new Map<string, PinData | null>();
    for (const p of existing) {
      const key = looseLabelKey(p.cavity);
      byFolded.set(key, byFolded.has(key) ? null : p);
    }

    const resolve = (row: PinRow, before: PinFields, selfId: number | null): PinFields => {
      const v = row.values;
      const after: PinFields = { ...before };
      // "GN/YE" stored by hand and "GNYE" from the file are one colour: not a change.
      if (v.colour !== undefined && !sameColour(before.colour, v.colour)) after.colour = v.colour;
      for (const key of VALUE_FIELDS) {
        if (v[key] !== undefined) (after as unknown as Record<string, unknown>)[key] = v[key];
      }
      if (v.destination !== undefined) {
        const text = v.destination.replace(/^→\s*/, '').trim();
        const linked = text ? linkTargets.get(text.toUpperCase()) : undefined;
        const feedWord = /^feed:\s*(.+)$/i.exec(text);
        if (linked != null && linked !== selfId) {
          after.destination = '';
          after.destinationPinId = linked;
        } else if (
          feedWord &&
          !imported.has('feed') &&
          feedsByName.has(feedWord[1]!.trim().toUpperCase())
        ) {
          // Hand-made files write "Feed: ECU main" in the destination; ours use the feed column.
          after.destination = '';
          after.destinationPinId = null;
          after.destinationFeedId = feedsByName.get(feedWord[1]!.trim().toUpperCase())!;
        } else {
          after.destination = v.destination;
          after.destinationPinId = null;
        }
      }
      if (v.feed !== undefined) {
        if (v.feed === '') after.destinationFeedId = null;
        else {
          const id = feedsByName.get(v.feed.toUpperCase());
          if (id === undefined) {
            errors.push({
              row: row.row,
              column: headerOf('feed'),
              message: `This conversion has no feed "${v.feed}" (feeds: ${feedList}). Add the feed first, or correct the name.`,
            });
          } else after.destinationFeedId = id;
        }
      }
      return after;
    };

    const plan: ConnectorPlan = {
      connectorId: connector.id,
      label: connector.label,
      adds: [],
      updates: [],
      removes: [],
      cavityCount: connector.cavityCount,
      rows: connector.rows,
      columns: connector.columns,
      grows: null,
      reshaped: false,
      feedLinksMove: false,
    };
    const kept = new Map<number, PinData>();
    const newVersions = new Map<number, PinData>();
    const addsInOrder: Array<PinFields & { cavity: string }> = [];
    for (const row of fileRows ?? []) {
      const pin = byCavity.get(row.cavity) ?? byFolded.get(looseLabelKey(row.cavity)) ?? null;
      if (pin) {
        kept.set(pin.id, pin);
        const after = resolve(row, pin, pin.id);
        if (SHOWN_FIELDS.some((key) => differs(key, pin, after))) {
          summary.changed++;
          changes.push(
            withFields(
              {
                kind: 'change',
                connector: connector.label,
                cavity: pin.cavity,
                row: row.row,
                pinId: pin.id,
              },
              () => fieldChanges(pin, after, names, unit),
            ),
          );
          newVersions.set(pin.id, { ...pin, ...after, version: pin.version + 1 });
        } else summary.unchanged++;
      } else {
        const after = resolve(row, BLANK_PIN_VALUES, null);
        summary.added++;
        changes.push(
          withFields(
            { kind: 'add', connector: connector.label, cavity: row.cavity, row: row.row },
            () => fieldChanges(BLANK_PIN_VALUES, after, names, unit),
          ),
        );
        addsInOrder.push({ ...after, cavity: row.cavity });
      }
    }

    const missing = existing.filter((p) => !kept.has(p.id) && !named?.has(looseLabelKey(p.cavity)));
    const inUse = missing.filter((p) => pinHoldsData(p) || ctx.referencedPinIds.has(p.id));
    if (inUse.length) {
      const list = inUse.map((p) => p.cavity);
      errors.push({
        row: null,
        column: null,
        message:
          `${connector.label}: ${list.length === 1 ? 'cavity' : 'cavities'} ${list.slice(0, 20).join(', ')}${list.length > 20 ? ` and ${list.length - 20} more` : ''} ` +
          `${list.length === 1 ? 'is' : 'are'} not in the file but ${list.length === 1 ? 'holds' : 'hold'} decisions or wire data, or other pins or feeds point at ${list.length === 1 ? 'it' : 'them'}. ` +
          'Add them to the file, or clear them on the pin map first. The file replaces the whole pinout of the connector.',
      });
    }
    for (const pin of missing) {
      if (inUse.includes(pin)) continue;
      summary.removed++;
      plan.removes.push(pin.id);
      changes.push({
        kind: 'remove',
        connector: connector.label,
        cavity: pin.cavity,
        pinId: pin.id,
        blank: true,
      });
    }

    // Face order: the pins that stay keep theirs; new cavities follow in file order.
    const removed = new Set(plan.removes);
    const staying = existing.filter((p) => !removed.has(p.id));
    staying.forEach((pin, position) => {
      const next = newVersions.get(pin.id);
      if (next) plan.updates.push({ ...next, position });
      else if (pin.position !== position) plan.updates.push({ ...pin, position });
    });
    addsInOrder.forEach((add, i) => plan.adds.push({ ...add, position: staying.length + i }));
    // A connector that had cavities and gets new ones from the file grows: the person confirms it.
    if (existing.length > 0 && addsInOrder.length > 0) {
      plan.grows = { from: connector.cavityCount, cavities: addsInOrder.map((a) => a.cavity) };
    }
    plan.cavityCount = staying.length + plan.adds.length;
    if (plan.cavityCount > MAX_CAVITIES) {
      errors.push({
        row: null,
        column: null,
        message: `${connector.label} would have ${plan.cavityCount} cavities; a connector holds at most ${MAX_CAVITIES}. Split the pinout over more connectors.`,
      });
    }
    if (plan.rows * plan.columns < plan.cavityCount) {
      // A connector that grows keeps its row count (or takes the usual one), as the pin map does.
      plan.rows = Math.max(
        plan.rows,
        defaultFaceLayout(Math.min(plan.cavityCount, MAX_CAVITIES)).rows,
      );
      plan.columns = Math.ceil(plan.cavityCount / plan.rows);
    }
    const before = new Map(existing.map((p) => [p.id, p.destinationFeedId]));
    plan.feedLinksMove =
      plan.adds.some((p) => p.destinationFeedId != null) ||
      plan.updates.some((p) => (p.destinationFeedId ?? null) !== (before.get(p.id) ?? null));
    plan.reshaped =
      plan.cavityCount !== connector.cavityCount ||
      plan.rows !== connector.rows ||
      plan.columns !== connector.columns;
    plans.push(plan);
  }

  return { errors, changes, summary, connectors: plans };
}
