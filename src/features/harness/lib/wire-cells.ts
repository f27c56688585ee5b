import { WIRE_ZONE_LABELS, WIRE_ZONES, type WireZone } from '#shared/schemas/feeds.schema.ts';
import type { UpdateWireRequest, Wire, WireEnd } from '#shared/schemas/harness.schema.ts';

/** The grid's columns, left to right. */
export const WIRE_COLUMNS = [
  'label',
  'colour',
  'size',
  'length',
  'zone',
  'endA',
  'endB',
  'twist',
  'shielded',
  'notes',
] as const;
export type WireColumnId = (typeof WIRE_COLUMNS)[number];

export const WIRE_COLUMN_HEADERS: Record<WireColumnId, string> = {
  label: 'Label',
  colour: 'Colour',
  size: 'Size (mm²)',
  length: 'Length (m)',
  zone: 'Zone',
  endA: 'End A',
  endB: 'End B',
  twist: 'Twist group',
  shielded: 'Shielded',
  notes: 'Notes',
};

export const WIRE_COLUMN_WIDTHS: Record<WireColumnId, number> = {
  label: 76,
  colour: 96,
  size: 80,
  length: 80,
  zone: 140,
  endA: 220,
  endB: 220,
  twist: 84,
  shielded: 80,
  notes: 140,
};

export type EditorKind = 'text' | 'zone' | 'end';
export const editorKind = (col: WireColumnId): EditorKind =>
  col === 'zone' ? 'zone' : col === 'endA' || col === 'endB' ? 'end' : 'text';

const num = (v: number | null) => (v === null ? '' : String(v));

/** The text a cell's editor starts from. */
export function cellText(wire: Wire, col: WireColumnId): string {
  switch (col) {
    case 'label':
      return wire.label;
    case 'colour':
      return wire.colour;
    case 'size':
      return num(wire.sizeMm2);
    case 'length':
      return num(wire.lengthM);
    case 'zone':
      return wire.zone;
    case 'notes':
      return wire.notes;
    case 'twist':
      return wire.twistGroup ?? '';
    case 'shielded':
      return wire.shielded ? 'yes' : 'no';
    case 'endA':
    case 'endB':
      return '';
  }
}

export const zoneLabel = (z: WireZone) => WIRE_ZONE_LABELS[z];
export const ZONE_CHOICES = WIRE_ZONES;

/** A typed number, or null for an empty cell; undefined when it is not a number. */
function parseNumber(text: string): number | null | undefined {
  const t = text.trim().replace(',', '.');
  if (t === '') return null;
  const n = Number(t);
  return Number.isFinite(n) ? n : undefined;
}

export type CellChange =
  { ok: true; patch: Omit<UpdateWireRequest, 'version'> } | { ok: false; message: string };

/** What saving a text typed into a cell changes on the wire, or why it cannot. */
export function cellChange(col: WireColumnId, text: string): CellChange {
  switch (col) {
    case 'label':
      return text.trim()
        ? { ok: true, patch: { label: text.trim() } }
        : { ok: false, message: 'A wire needs a label.' };
    case 'colour':
      return { ok: true, patch: { colour: text.trim() } };
    case 'notes':
      return { ok: true, patch: { notes: text } };
    case 'twist':
      return text.trim().length <= 12
        ? { ok: true, patch: { twistGroup: text.trim() } }
        : { ok: false, message: 'A twist group is at most 12 characters ("T1").' };
    case 'shielded': {
      const t = text.trim().toLowerCase();
      if (['y', 'yes', 'true', '1'].includes(t)) return { ok: true, patch: { shielded: true } };
      if (['', 'n', 'no', 'false', '0'].includes(t))
        return { ok: true, patch: { shielded: false } };
      return { ok: false, message: 'Type yes or no.' };
    }
    case 'zone':
      return (WIRE_ZONES as readonly string[]).includes(text)
        ? { ok: true, patch: { zone: text as WireZone } }
        : { ok: false, message: 'Pick cabin or engine bay.' };
    case 'size':
    case 'length': {
      const n = parseNumber(text);
      if (n === undefined) return { ok: false, message: 'Type a number, or leave it empty.' };
      return { ok: true, patch: col === 'size' ? { sizeMm2: n } : { lengthM: n } };
    }
    case 'endA':
    case 'endB':
      return { ok: false, message: 'Pick an end from the list.' };
  }
}

/** The wire's ends with one of them replaced. */
export function withEnd(wire: Wire, col: 'endA' | 'endB', end: WireEnd): [WireEnd, WireEnd] {
  return col === 'endA' ? [end, wire.ends[1]] : [wire.ends[0], end];
}
