/**
 * What the cell editor offers as you type: the choices of a choice column, or suggestions for a
 * column that also takes free text (colours, sizes, insulation ratings, destinations).
 */
import { DISPOSITION_INFO, DISPOSITIONS, type Disposition } from '#shared/domain/dispositions.ts';
import { SIGNAL_CLASS_LABELS, SIGNAL_CLASSES } from '#shared/domain/signal-classes.ts';
import {
  COLOUR_CODES,
  GREEN_YELLOW,
  IEC_60757_COLOURS,
  describeWireColour,
  type ColourCode,
} from '#shared/domain/wire-colours.ts';
import { AWG_GAUGES, formatAwgGauge, ISO_6722_SIZES_MM2 } from '#shared/domain/wire-sizes.ts';
import { INSULATION_RATINGS_C } from '#shared/schemas/workshop.schema.ts';
import type { CellContext, EditableColumnId } from './cell-values.ts';
import { feedDestination } from './rows.ts';

export interface EditorOption {
  key: string;
  /** The text that choosing this option commits, read by the column's parser. */
  commit: string;
  label: string;
  hint?: string;
  disposition?: Disposition;
  /** A canonical colour ("BU/WH"), drawn as swatches beside the code. */
  colour?: string;
}

/**
 * choice: pick one of a fixed list, typing narrows it; suggest: free text with suggestions;
 * typeahead: typing highlights the first suggestion and Enter takes it, free text only when
 * nothing matches or "use as typed" is picked; text: free text only.
 */
export type EditorKind = 'choice' | 'suggest' | 'typeahead' | 'text';

export function editorKind(column: EditableColumnId): EditorKind {
  switch (column) {
    case 'disposition':
    case 'signalClass':
      return 'choice';
    case 'colour':
    case 'size':
    case 'insulation':
      return 'suggest';
    case 'destination':
      return 'typeahead';
    default:
      return 'text';
  }
}

/** The width of the editor's list of choices, px: 0 for plain text, which has none. */
export function editorListWidth(column: EditableColumnId): number {
  if (column === 'destination') return 340;
  return editorKind(column) === 'text' ? 0 : 240;
}

const MAX_OPTIONS = 40;
const fold = (s: string) => s.trim().toLowerCase();

function dispositionOptions(text: string): EditorOption[] {
  const needle = fold(text);
  return DISPOSITIONS.filter((d) => {
    const info = DISPOSITION_INFO[d];
    return !needle || [d, info.label, info.short].some((w) => fold(w).includes(needle));
  }).map((d) => ({
    key: d,
    commit: DISPOSITION_INFO[d].label,
    label: DISPOSITION_INFO[d].label,
    disposition: d,
  }));
}

function signalClassOptions(text: string): EditorOption[] {
  const needle = fold(text);
  return SIGNAL_CLASSES.filter(
    (s) => !needle || fold(SIGNAL_CLASS_LABELS[s]).includes(needle) || s.includes(needle),
  ).map((s) => ({
    key: s,
    commit: s === 'none' ? '' : SIGNAL_CLASS_LABELS[s],
    label: SIGNAL_CLASS_LABELS[s],
  }));
}

const colourOption = (value: string): EditorOption => ({
  key: value,
  commit: value,
  label: value,
  hint: describeWireColour(value),
  colour: value,
});

const isCode = (s: string): s is ColourCode => (COLOUR_CODES as string[]).includes(s);

/** "" → every base colour; "BU" or "BU/" → blue and blue with each stripe; "bl" → by name too. */
export function colourOptions(text: string): EditorOption[] {
  const t = text.trim().toUpperCase();
  const pair = /^([A-Z]{2})(?:\s*[/\-\s]\s*([A-Z]{0,2}))?$/.exec(t);
  if (pair && isCode(pair[1]!) && (pair[2] !== undefined || t.length === 2)) {
    const base = pair[1]!;
    const stripePrefix = pair[2] ?? '';
    const stripes = COLOUR_CODES.filter((c) => c !== base && c.startsWith(stripePrefix));
    const values = [...(stripePrefix ? [] : [base]), ...stripes.map((s) => `${base}/${s}`)];
    if (base === 'GN' && 'YE'.startsWith(stripePrefix))
      values.splice(stripePrefix ? 0 : 1, 0, GREEN_YELLOW);
    return values.slice(0, MAX_OPTIONS).map(colourOption);
  }
  const squashed = t.replace(/[^A-Z]/g, '');
  const bases = COLOUR_CODES.filter(
    (c) => !t || c.startsWith(t) || IEC_60757_COLOURS[c].name.toUpperCase().startsWith(t),
  );
  const withGreenYellow =
    !t || (squashed && GREEN_YELLOW.startsWith(squashed)) ? [...bases, GREEN_YELLOW] : bases;
  return withGreenYellow.slice(0, MAX_OPTIONS).map(colourOption);
}

function sizeOptions(text: string, ctx: CellContext): EditorOption[] {
  const t = text.trim().replace(',', '.');
  if (ctx.sizeUnit === 'awg') {
    return AWG_GAUGES.map(formatAwgGauge)
      .filter((g) => !t || g.startsWith(t))
      .reverse()
      .map((g) => ({ key: g, commit: g, label: `${g} AWG` }));
  }
  return ISO_6722_SIZES_MM2.map(String)
    .filter((s) => !t || s.startsWith(t))
    .map((s) => ({ key: s, commit: s, label: `${s} mm²` }));
}

function insulationOptions(text: string): EditorOption[] {
  const t = text.trim();
  return INSULATION_RATINGS_C.map(String)
    .filter((r) => !t || r.startsWith(t))
    .map((r) => ({ key: r, commit: r, label: `${r} °C` }));
}

/** Vehicle-side cavities whose name or function holds the text, names that start with it first. */
export function destinationOptions(
  text: string,
  ctx: CellContext,
  selfPinId: number | null,
): EditorOption[] {
  const needle = fold(text.replace(/^→\s*/, ''));
  const candidates = ctx.destinations.filter((d) => d.pinId !== selfPinId);
  const starts = candidates.filter((d) => fold(d.name).startsWith(needle));
  const contains = needle
    ? candidates.filter(
        (d) =>
          !fold(d.name).startsWith(needle) &&
          (fold(d.name).includes(needle) || fold(d.function).includes(needle)),
      )
    : [];
  const cavities = [...starts, ...contains].map((d) => ({
    key: `pin-${d.pinId}`,
    commit: d.name,
    label: d.name,
    hint: d.function || 'no function yet',
  }));
  const feeds = (ctx.feeds ?? [])
    .map((f) => feedDestination(f.name))
    .filter((name) => !needle || fold(name).includes(needle))
    .map((name) => ({ key: `feed-${name}`, commit: name, label: name, hint: 'new fused feed' }));
  return [...feeds, ...cavities].slice(0, MAX_OPTIONS);
}

/** The key of the option that keeps the text exactly as typed. */
export const AS_TYPED_KEY = 'as-typed';

/**
 * A type-ahead's suggestions and, after them, the typed text itself, unless a suggestion already
 * reads the same: a destination a person spells out still goes in, but only when they pick it.
 */
export function withAsTyped(text: string, options: EditorOption[]): EditorOption[] {
  const typed = text.trim();
  if (!typed || options.some((o) => fold(o.commit) === fold(typed))) return options;
  return [
    ...options,
    { key: AS_TYPED_KEY, commit: typed, label: `Use “${typed}” as typed`, hint: 'free text' },
  ];
}

export function editorOptions(
  column: EditableColumnId,
  text: string,
  ctx: CellContext,
  selfPinId: number | null,
): EditorOption[] {
  switch (column) {
    case 'disposition':
      return dispositionOptions(text);
    case 'signalClass':
      return signalClassOptions(text);
    case 'colour':
      return colourOptions(text);
    case 'size':
      return sizeOptions(text, ctx);
    case 'insulation':
      return insulationOptions(text);
    case 'destination':
      return withAsTyped(text, destinationOptions(text, ctx, selfPinId));
    default:
      return [];
  }
}
