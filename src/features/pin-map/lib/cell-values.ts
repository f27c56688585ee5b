/**
 * Reading what a person typed or pasted into one column of the pin grid. The editor, paste, the
 * selection toolbar and the tests all go through these parsers, so a value means the same thing
 * however it arrives.
 */
import { DISPOSITION_INFO, DISPOSITIONS, type Disposition } from '#shared/domain/dispositions.ts';
import {
  SIGNAL_CLASS_LABELS,
  SIGNAL_CLASSES,
  type SignalClass,
} from '#shared/domain/signal-classes.ts';
import { parseWireColour } from '#shared/domain/wire-colours.ts';
import { parseWireSize } from '#shared/domain/wire-sizes.ts';
import { PinFields, type PinChanges } from '#shared/schemas/pin-map.schema.ts';
import { INSULATION_RATINGS_C, type SizeUnit } from '#shared/schemas/workshop.schema.ts';
import { feedDestination, type DestinationCavity, type DestinationFeed } from './rows.ts';

export type Parse<T> = { ok: true; value: T } | { ok: false; error: string };

const ok = <T>(value: T): Parse<T> => ({ ok: true, value });
const fail = <T>(error: string): Parse<T> => ({ ok: false, error });

/** Lower case, letters and digits only: "De-pin" → "depin", "Shield / drain" → "shielddrain". */
const squash = (text: string) => text.toLowerCase().replace(/[^a-z0-9]/g, '');

function aliasTable<T extends string>(entries: Array<[T, string[]]>): Map<string, T> {
  const table = new Map<string, T>();
  for (const [value, aliases] of entries) {
    for (const alias of aliases) table.set(squash(alias), value);
  }
  return table;
}

const DISPOSITION_ALIASES = aliasTable<Disposition>(
  DISPOSITIONS.map((d) => {
    const info = DISPOSITION_INFO[d];
    const firstWord = info.label.split(/[\s/]+/)[0] ?? d;
    return [d, [d, info.label, info.short === '?' ? 'undecided' : info.short, firstWord]];
  }),
);
// The other half of "Extend / reroute" is a word people use on its own.
DISPOSITION_ALIASES.set('reroute', 'extend');

/** "De-pin", "depin", "Keep as is", "keep", "ext": by label, code or short word. Empty is undecided. */
export function parseDisposition(text: string): Parse<Disposition> {
  if (text.trim() === '') return ok('undecided');
  const found = DISPOSITION_ALIASES.get(squash(text));
  if (found) return ok(found);
  const words = DISPOSITIONS.map((d) => DISPOSITION_INFO[d].label).join(', ');
  return fail(`"${text.trim()}" is not a disposition: use one of ${words}`);
}

const SIGNAL_CLASS_ALIASES = aliasTable<SignalClass>(
  SIGNAL_CLASSES.map((s) => [s, [s, SIGNAL_CLASS_LABELS[s]]]),
);
SIGNAL_CLASS_ALIASES.set('shield', 'shield');
SIGNAL_CLASS_ALIASES.set('drain', 'shield');
SIGNAL_CLASS_ALIASES.set('none', 'none');

/** "Sensor ground" or "sensor_ground"; empty is "Not set". */
export function parseSignalClass(text: string): Parse<SignalClass> {
  if (text.trim() === '') return ok('none');
  const found = SIGNAL_CLASS_ALIASES.get(squash(text));
  if (found) return ok(found);
  const words = SIGNAL_CLASSES.map((s) => SIGNAL_CLASS_LABELS[s]).join(', ');
  return fail(`"${text.trim()}" is not a signal class: use one of ${words}`);
}

/** "1.5", "1,5", "1.5 m": a number with an optional unit, within [min, max]; empty is null. */
export function parseMeasure(
  text: string,
  unit: { suffixes: RegExp; name: string; min: number; max: number },
): Parse<number | null> {
  const bare = text.trim().replace(unit.suffixes, '').trim().replace(',', '.');
  if (bare === '') return ok(null);
  const value = Number(bare);
  if (!/^\d*\.?\d+$/.test(bare) || !Number.isFinite(value)) {
    return fail(`"${text.trim()}" is not a number of ${unit.name}`);
  }
  if (value < unit.min || value > unit.max) {
    return fail(`${value} is outside ${unit.min} to ${unit.max} ${unit.name}`);
  }
  return ok(value);
}

export const RUN_LENGTH = {
  suffixes: /\s*(m|metres?|meters?)$/i,
  name: 'metres',
  min: 0,
  max: 100,
};
export const LOAD_CURRENT = {
  suffixes: /\s*(a|amps?|amperes?)$/i,
  name: 'amperes',
  min: 0,
  max: 200,
};

/** "105", "105 °C", "105C": one of the insulation ratings wire is sold in. */
export function parseInsulationRating(text: string): Parse<number | null> {
  const bare = text
    .trim()
    .replace(/\s*°?\s*c$/i, '')
    .trim();
  if (bare === '') return ok(null);
  const value = Number(bare);
  if (!(INSULATION_RATINGS_C as readonly number[]).includes(value)) {
    return fail(
      `"${text.trim()}" is not an insulation rating: use ${INSULATION_RATINGS_C.join(', ')} °C`,
    );
  }
  return ok(value);
}

export interface DestinationSet {
  destination: string;
  destinationPinId: number | null;
  destinationFeedId: number | null;
}

/**
 * A destination is one of three things: a vehicle-side cavity named as "V1-3" (also "→ V1-3"), a
 * new feed named as "Feed: ECU main", or free text. Setting one clears the others; empty clears all.
 */
export function parseDestination(
  text: string,
  cavities: readonly DestinationCavity[],
  selfPinId: number | null,
  feeds: readonly DestinationFeed[] = [],
): Parse<DestinationSet> {
  const trimmed = text.replace(/\s+/g, ' ').trim().replace(/^→\s*/, '');
  const none = { destination: '', destinationPinId: null, destinationFeedId: null };
  if (trimmed === '') return ok(none);
  const wanted = trimmed.toUpperCase();
  const cavity = cavities.find((c) => c.name.toUpperCase() === wanted);
  if (cavity) {
    if (cavity.pinId === selfPinId) return fail(`a pin cannot be its own destination`);
    return ok({ ...none, destinationPinId: cavity.pinId });
  }
  const feed = feeds.find((f) => feedDestination(f.name).toUpperCase() === wanted);
  if (feed) return ok({ ...none, destinationFeedId: feed.feedId });
  const checked = PinFields.shape.destination.safeParse(trimmed);
  if (!checked.success) return fail('a destination is at most 200 characters');
  return ok({ ...none, destination: checked.data });
}

export function parseText(text: string, max: number, oneLine = false): Parse<string> {
  const trimmed = oneLine ? text.replace(/\s+/g, ' ').trim() : text.trim();
  if (trimmed.length > max) return fail(`at most ${max} characters (this is ${trimmed.length})`);
  return ok(trimmed);
}

/** What a parser needs to know besides the text. */
export interface CellContext {
  sizeUnit: SizeUnit;
  destinations: readonly DestinationCavity[];
  /** The conversion's new feeds; optional for callers with none. */
  feeds?: readonly DestinationFeed[];
}

export type CellParse = { ok: true; set: PinChanges } | { ok: false; error: string };

function asChanges<T>(parsed: Parse<T>, toSet: (value: T) => PinChanges): CellParse {
  return parsed.ok ? { ok: true, set: toSet(parsed.value) } : parsed;
}

/** The columns a person can type into, and the fields each one sets. */
const EDITABLE_COLUMNS = [
  'function',
  'signalClass',
  'colour',
  'size',
  'insulation',
  'disposition',
  'destination',
  'runLength',
  'load',
  'notes',
] as const;
export type EditableColumnId = (typeof EDITABLE_COLUMNS)[number];

export const isEditableColumn = (id: string): id is EditableColumnId =>
  (EDITABLE_COLUMNS as readonly string[]).includes(id);

/** Reads one cell's text into the pin fields it sets, or says why it cannot. */
export function parseCell(
  columnId: EditableColumnId,
  text: string,
  ctx: CellContext,
  pinId: number | null = null,
): CellParse {
  switch (columnId) {
    case 'function':
      return asChanges(parseText(text, 200, true), (v) => ({ function: v }));
    case 'notes':
      return asChanges(parseText(text, 2000), (v) => ({ notes: v }));
    case 'signalClass':
      return asChanges(parseSignalClass(text), (v) => ({ signalClass: v }));
    case 'disposition':
      return asChanges(parseDisposition(text), (v) => ({ disposition: v }));
    case 'colour': {
      if (text.trim() === '') return { ok: true, set: { colour: '' } };
      const parsed = parseWireColour(text);
      return parsed.ok ? { ok: true, set: { colour: parsed.value } } : parsed;
    }
    case 'size': {
      const parsed = parseWireSize(text, ctx.sizeUnit);
      return parsed.ok ? { ok: true, set: { sizeMm2: parsed.areaMm2 } } : parsed;
    }
    case 'insulation':
      return asChanges(parseInsulationRating(text), (v) => ({ insulationRatingC: v }));
    case 'destination':
      return asChanges(parseDestination(text, ctx.destinations, pinId, ctx.feeds), (v) => v);
    case 'runLength':
      return asChanges(parseMeasure(text, RUN_LENGTH), (v) => ({ runLengthM: v }));
    case 'load':
      return asChanges(parseMeasure(text, LOAD_CURRENT), (v) => ({ loadCurrentA: v }));
  }
}
