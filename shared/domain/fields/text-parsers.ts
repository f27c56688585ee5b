/**
 * Readers for what a person types or pastes into a field, shared by the grid, the CSV import and
 * the field tables: a value means the same thing however it arrives.
 */
import { DISPOSITION_INFO, DISPOSITIONS, type Disposition } from '../dispositions.ts';
import { SIGNAL_CLASS_LABELS, SIGNAL_CLASSES, type SignalClass } from '../signal-classes.ts';
import { normalizeText, textProblem } from '../../schemas/common.schema.ts';
import { DRIVER_TYPE_LABELS, DRIVER_TYPES, type DriverType } from '../electrical/relays.ts';
import { INSULATION_RATINGS_C } from '../../schemas/workshop.schema.ts';
import { parsed, refused, type FieldParse } from './field-table.ts';

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
export function parseDisposition(text: string): FieldParse<Disposition> {
  if (text.trim() === '') return parsed('undecided');
  const found = DISPOSITION_ALIASES.get(squash(text));
  if (found) return parsed(found);
  const words = DISPOSITIONS.map((d) => `${d} (${DISPOSITION_INFO[d].label})`).join(', ');
  return refused(`"${text.trim()}" is not a disposition: use one of ${words}`);
}

const SIGNAL_CLASS_ALIASES = aliasTable<SignalClass>(
  SIGNAL_CLASSES.map((s) => [s, [s, SIGNAL_CLASS_LABELS[s]]]),
);
SIGNAL_CLASS_ALIASES.set('shield', 'shield');
SIGNAL_CLASS_ALIASES.set('drain', 'shield');
SIGNAL_CLASS_ALIASES.set('none', 'none');

/** "Sensor ground" or "sensor_ground"; empty is "Not set". */
export function parseSignalClass(text: string): FieldParse<SignalClass> {
  if (text.trim() === '') return parsed('none');
  const found = SIGNAL_CLASS_ALIASES.get(squash(text));
  if (found) return parsed(found);
  const words = SIGNAL_CLASSES.map((s) => `${s} (${SIGNAL_CLASS_LABELS[s]})`).join(', ');
  return refused(`"${text.trim()}" is not a signal class: use one of ${words}`);
}

export interface Measure {
  suffixes: RegExp;
  name: string;
  min: number;
  max: number;
}

/** "1.5", "1,5", "1.5 m": a number with an optional unit, within [min, max]; empty is null. */
export function parseMeasure(text: string, unit: Measure): FieldParse<number | null> {
  const bare = text.trim().replace(unit.suffixes, '').trim().replace(',', '.');
  if (bare === '') return parsed(null);
  const value = Number(bare);
  // Exponent notation too: it is how the shortest exact text of a very small number is written.
  if (!/^\d*\.?\d+(e[-+]?\d+)?$/i.test(bare) || !Number.isFinite(value)) {
    return refused(`"${text.trim()}" is not a number of ${unit.name}`);
  }
  if (value < unit.min || value > unit.max) {
    return refused(`${value} is outside ${unit.min} to ${unit.max} ${unit.name}`);
  }
  return parsed(value);
}

export const RUN_LENGTH: Measure = {
  suffixes: /\s*(m|metres?|meters?)$/i,
  name: 'metres',
  min: 0,
  max: 100,
};
export const LOAD_CURRENT: Measure = {
  suffixes: /\s*(a|amps?|amperes?)$/i,
  name: 'amperes',
  min: 0,
  max: 200,
};

export const DRIVER_CURRENT: Measure = {
  suffixes: /\s*(a|amps?|amperes?)$/i,
  name: 'amperes',
  min: 0.001,
  max: 50,
};

/** Short names for an output stage, as a grid cell shows it. */
export const DRIVER_TYPE_SHORT: Record<DriverType, string> = {
  low_side: 'Low side',
  high_side: 'High side',
  push_pull: 'Push-pull',
  open_collector: 'Open collector',
};

const DRIVER_TYPE_ALIASES = aliasTable<DriverType>(
  DRIVER_TYPES.map((d) => [d, [d, DRIVER_TYPE_LABELS[d], DRIVER_TYPE_SHORT[d]]]),
);
for (const [alias, d] of [
  ['ls', 'low_side'],
  ['lowside', 'low_side'],
  ['hs', 'high_side'],
  ['highside', 'high_side'],
  ['pp', 'push_pull'],
  ['totempole', 'push_pull'],
  ['oc', 'open_collector'],
  ['opendrain', 'open_collector'],
] as const)
  DRIVER_TYPE_ALIASES.set(alias, d);

/** "Low side", "LS", "low_side", "open drain"; empty is "not an output" (null). */
export function parseDriverType(text: string): FieldParse<DriverType | null> {
  if (text.trim() === '') return parsed(null);
  const found = DRIVER_TYPE_ALIASES.get(squash(text));
  if (found) return parsed(found);
  const words = DRIVER_TYPES.map((d) => `${d} (${DRIVER_TYPE_SHORT[d]})`).join(', ');
  return refused(`"${text.trim()}" is not an output stage: use one of ${words}`);
}

/** How a speed or engine-speed signal is carried: what an output sends, what an input expects. */
export const PULSE_SIGNALS = ['open_collector', 'square_5v', 'square_12v', 'ac_sine'] as const;
export type PulseSignal = (typeof PULSE_SIGNALS)[number];
export const PULSE_SIGNAL_LABELS: Record<PulseSignal, string> = {
  open_collector: 'Open collector',
  square_5v: '5 V square',
  square_12v: '12 V square',
  ac_sine: 'AC sine',
};
const PULSE_ALIASES = aliasTable<PulseSignal>(
  PULSE_SIGNALS.map((p) => [p, [p, PULSE_SIGNAL_LABELS[p]]]),
);
for (const [alias, p] of [
  ['oc', 'open_collector'],
  ['opendrain', 'open_collector'],
  ['5v', 'square_5v'],
  ['12v', 'square_12v'],
  ['ac', 'ac_sine'],
  ['sine', 'ac_sine'],
  ['vr', 'ac_sine'],
] as const)
  PULSE_ALIASES.set(alias, p);

/** "Open collector", "OC", "12 V square", "AC"; empty is "not a pulse signal" (null). */
export function parsePulseSignal(text: string): FieldParse<PulseSignal | null> {
  if (text.trim() === '') return parsed(null);
  const found = PULSE_ALIASES.get(squash(text));
  if (found) return parsed(found);
  const words = PULSE_SIGNALS.map((p) => `${p} (${PULSE_SIGNAL_LABELS[p]})`).join(', ');
  return refused(`"${text.trim()}" is not a pulse signal: use one of ${words}`);
}

export const PULSES_PER_REV: Measure = {
  suffixes: /\s*(\/\s*rev|per\s+rev(olution)?|pulses?|\/\s*km|per\s+km)$/i,
  name: 'pulses',
  min: 0.1,
  max: 100_000,
};

export const TERMINATION_OHM: Measure = {
  suffixes: /\s*(Ω|ohms?)$/i,
  name: 'ohms',
  min: 1,
  max: 100_000,
};

/** "105", "105 °C", "105C": one of the insulation ratings wire is sold in. */
export function parseInsulationRating(text: string): FieldParse<number | null> {
  const bare = text
    .trim()
    .replace(/\s*°?\s*c$/i, '')
    .trim();
  if (bare === '') return parsed(null);
  const value = Number(bare);
  if (!(INSULATION_RATINGS_C as readonly number[]).includes(value)) {
    return refused(
      `"${text.trim()}" is not an insulation rating: use ${INSULATION_RATINGS_C.join(', ')} °C`,
    );
  }
  return parsed(value);
}

/** Text as the API's `optionalText` (or, `multiline`, `noteText`) reads it: clean, trimmed, capped. */
export function parseText(text: string, max: number, multiline = false): FieldParse<string> {
  const trimmed = normalizeText(text, multiline).trim();
  const problem = textProblem(trimmed, multiline);
  if (problem) return refused(problem);
  if (trimmed.length > max) return refused(`at most ${max} characters (this is ${trimmed.length})`);
  return parsed(trimmed);
}
