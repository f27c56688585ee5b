/**
 * Reading what a person typed or pasted into one column of the pin grid. The editor, paste, the
 * selection toolbar and the tests all go through these parsers, so a value means the same thing
 * however it arrives.
 */
import {
  fieldColumns,
  type FieldParse,
  type FieldSpec,
} from '#shared/domain/fields/field-table.ts';
import { PIN_FIELDS, type PinFieldColumnId } from '#shared/domain/fields/pin-fields.ts';
import { PinFields, type PinChanges } from '#shared/schemas/pin-map.schema.ts';
import type { SizeUnit } from '#shared/schemas/workshop.schema.ts';
import { feedDestination, type DestinationCavity, type DestinationFeed } from './rows.ts';

export type Parse<T> = FieldParse<T>;

const ok = <T>(value: T): Parse<T> => ({ ok: true, value });
const fail = <T>(error: string): Parse<T> => ({ ok: false, error });

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

/** What a parser needs to know besides the text. */
export interface CellContext {
  sizeUnit: SizeUnit;
  destinations: readonly DestinationCavity[];
  /** The conversion's new feeds; optional for callers with none. */
  feeds?: readonly DestinationFeed[];
}

export type CellParse = { ok: true; set: PinChanges } | { ok: false; error: string };

/** The columns a person can type into: one per pin field column of the field table. */
export type EditableColumnId = PinFieldColumnId;
const EDITABLE_COLUMNS: ReadonlySet<string> = new Set(fieldColumns(PIN_FIELDS).map((c) => c.id));

export const isEditableColumn = (id: string): id is EditableColumnId => EDITABLE_COLUMNS.has(id);

/** Reads one cell's text into the pin fields it sets, or says why it cannot. */
export function parseCell(
  columnId: EditableColumnId,
  text: string,
  ctx: CellContext,
  pinId: number | null = null,
): CellParse {
  if (columnId === 'destination') {
    const parsed = parseDestination(text, ctx.destinations, pinId, ctx.feeds);
    return parsed.ok ? { ok: true, set: parsed.value } : parsed;
  }
  const key = (Object.keys(PIN_FIELDS) as Array<keyof PinFields>).find(
    (k) => PIN_FIELDS[k].column.id === columnId,
  )!;
  const parsed = (PIN_FIELDS[key] as FieldSpec<unknown>).parse(text, ctx.sizeUnit);
  return parsed.ok ? { ok: true, set: { [key]: parsed.value } as PinChanges } : parsed;
}
