/**
 * The pin field table: every field a person sets on a pin, once. To add a field, add its entry
 * here (and its column to the pins table by a migration); the API schema, the grid, the CSV import
 * and export, the import plan, the revision differences and the blank pin follow.
 */
import { z } from 'zod';
import { noteText, optionalText } from '../../schemas/common.schema.ts';
import {
  DispositionSchema,
  InsulationRatingSchema,
  SignalClassSchema,
  WireColourSchema,
  WireSizeMm2Schema,
} from '../../schemas/wire-fields.schema.ts';
import { DISPOSITION_INFO, type Disposition } from '../dispositions.ts';
import { SIGNAL_CLASS_LABELS, type SignalClass } from '../signal-classes.ts';
import { parseWireColour } from '../wire-colours.ts';
import {
  acceptedWireSize,
  editableWireSize,
  exactAwg,
  formatAwgGauge,
  formatWireSize,
  ISO_6722_SIZES_MM2,
  parseAwgGauge,
  parseWireSize,
  storedAwgAreaMm2,
} from '../wire-sizes.ts';
import {
  field,
  parsed,
  refused,
  templateKeys,
  type ColumnIdOf,
  type TemplateKeyOf,
  type FieldParse,
  type FieldTable,
} from './field-table.ts';
import { DRIVER_TYPES, type DriverType } from '../electrical/relays.ts';
import {
  parsePulseSignal,
  PULSE_SIGNAL_LABELS,
  PULSE_SIGNALS,
  PULSES_PER_REV,
  TERMINATION_OHM,
  type PulseSignal,
  DRIVER_CURRENT,
  DRIVER_TYPE_SHORT,
  parseDriverType,
  LOAD_CURRENT,
  parseDisposition,
  parseInsulationRating,
  parseMeasure,
  parseSignalClass,
  parseText,
  RUN_LENGTH,
} from './text-parsers.ts';

/** Every value a person sets on a pin. */
export interface PinValues {
  function: string;
  signalClass: SignalClass;
  colour: string;
  sizeMm2: number | null;
  insulationRatingC: number | null;
  disposition: Disposition;
  destination: string;
  /** A cavity of a vehicle-side connector of the same conversion. */
  destinationPinId: number | null;
  /** A new fused feed of the same conversion this pin is joined to. */
  destinationFeedId: number | null;
  runLengthM: number | null;
  loadCurrentA: number | null;
  /** For an ECU output: the stage that switches it. Null for a pin that is not an output. */
  driverType: DriverType | null;
  /** For an ECU output: the current its stage is rated to switch, A (the ECU maker's figure). */
  driverRatedA: number | null;
  /** For a speed or engine-speed pin: the signal it sends (output) or expects (input). */
  pulseSignal: PulseSignal | null;
  /** Pulses per revolution (engine speed) or per km (road speed) it sends or expects. */
  pulsesPerRev: number | null;
  /** A bus termination at this node, Ω, recorded on the bus's high pin (120 Ω for CAN). */
  terminationOhm: number | null;
  notes: string;
}

const numberText = (n: number | null) => (n == null ? '' : String(n));
const withUnit = (unit: string) => (n: number | null) => (n == null ? '' : `${n} ${unit}`);

/** "0,75" and "0.75 mm²" alike: an area within 1 % of an accepted size is that size. */
function readAreaMm2(text: string): FieldParse<number | null> {
  const bare = text.trim().replace(/\s*mm(²|2|\^2)?$/i, '');
  if (bare === '') return parsed(null);
  const area =
    /^\d*(?:[.,]\d+)?$/.test(bare) && bare !== '.' ? Number(bare.replace(',', '.')) : NaN;
  if (!(area > 0 && area <= 120)) return refused(`"${text.trim()}" is not a wire size in mm²`);
  const size = acceptedWireSize(area);
  if (size === null) {
    return refused(
      `${area} mm² is neither an ISO 6722 size (${ISO_6722_SIZES_MM2.join(', ')}) nor the area of an AWG size`,
    );
  }
  return parsed(size);
}

function readAwg(text: string): FieldParse<number | null> {
  if (text.trim() === '') return parsed(null);
  const gauge = parseAwgGauge(text);
  if (gauge === null) return refused(`"${text.trim()}" is not an AWG size between 4/0 and 30`);
  return parsed(storedAwgAreaMm2(gauge));
}

/** A record id typed as digits; empty is none. */
function parseId(text: string): FieldParse<number | null> {
  const t = text.trim();
  if (t === '') return parsed(null);
  return /^[1-9]\d{0,15}$/.test(t) ? parsed(Number(t)) : refused(`"${t}" is not a record id`);
}

const LinkId = z.number().int().positive().nullable();

export const PIN_FIELDS = {
  function: field({
    inTemplate: true,
    label: 'Function',
    // Donor pinout sheets often break a long function over two lines; the import keeps that.
    schema: noteText(200),
    blank: '',
    parse: (text) => parseText(text, 200, true),
    format: (v) => v,
    csv: [{ header: 'function', label: 'Function' }],
    column: { id: 'function', heading: 'Function' },
  }),
  signalClass: field({
    inTemplate: true,
    label: 'Signal class',
    schema: SignalClassSchema,
    blank: 'none' as SignalClass,
    parse: parseSignalClass,
    format: (v) => (v === 'none' ? '' : SIGNAL_CLASS_LABELS[v]),
    csv: [{ header: 'signal_class', label: 'Signal class', write: (v) => v }],
    column: { id: 'signalClass', heading: 'Signal class' },
  }),
  colour: field({
    inTemplate: true,
    label: 'Colour',
    schema: WireColourSchema,
    blank: '',
    parse: (text) => {
      if (text.trim() === '') return parsed('');
      if (text.trim().length > 20)
        return refused(`"${text.trim().slice(0, 20)}…" is not a wire colour`);
      const colour = parseWireColour(text);
      return colour.ok ? parsed(colour.value) : refused(colour.error);
    },
    format: (v) => v,
    csv: [{ header: 'colour', label: 'Wire colour (IEC 60757)', aliases: ['color'] }],
    column: { id: 'colour', heading: 'Colour' },
  }),
  sizeMm2: field({
    inTemplate: true,
    label: 'Size',
    schema: WireSizeMm2Schema,
    blank: null,
    parse: (text, unit) => {
      const size = parseWireSize(text, unit);
      return size.ok ? parsed(size.areaMm2) : refused(size.error);
    },
    format: editableWireSize,
    show: formatWireSize,
    csv: [
      { header: 'size_mm2', label: 'Wire size, mm²', write: (v) => v, read: readAreaMm2 },
      {
        header: 'awg',
        label: 'Wire size, AWG',
        write: (v) => {
          const gauge = v == null ? null : exactAwg(v);
          return gauge === null ? null : formatAwgGauge(gauge);
        },
        read: readAwg,
      },
    ],
    column: { id: 'size', heading: (unit) => (unit === 'awg' ? 'Size AWG' : 'Size mm²') },
  }),
  insulationRatingC: field({
    inTemplate: true,
    label: 'Insulation',
    schema: InsulationRatingSchema,
    blank: null,
    parse: parseInsulationRating,
    format: numberText,
    show: withUnit('°C'),
    csv: [{ header: 'insulation_c', label: 'Insulation rating, °C', write: (v) => v }],
    column: { id: 'insulation', heading: 'Insul. °C' },
  }),
  disposition: field({
    inTemplate: true,
    label: 'Disposition',
    schema: DispositionSchema,
    blank: 'undecided' as Disposition,
    parse: parseDisposition,
    format: (v) => DISPOSITION_INFO[v].label,
    csv: [{ header: 'disposition', label: 'Disposition', write: (v) => v }],
    column: { id: 'disposition', heading: 'Disposition' },
  }),
  destination: field({
    label: 'Destination',
    schema: optionalText(200),
    blank: '',
    parse: (text) => parseText(text, 200),
    format: (v) => v,
    // The column also carries a link to a vehicle-side cavity, written as its name ("V1-3").
    csv: [{ header: 'destination', label: 'Destination' }],
    column: { id: 'destination', heading: 'Destination' },
  }),
  destinationPinId: field({
    label: 'Linked cavity',
    schema: LinkId,
    blank: null,
    parse: parseId,
    format: numberText,
    csv: [],
    column: { id: 'destination', heading: 'Destination' },
  }),
  destinationFeedId: field({
    label: 'Joined to feed',
    schema: LinkId,
    blank: null,
    parse: parseId,
    format: numberText,
    csv: [{ header: 'feed', label: 'Joined to feed', names: 'feed' }],
    column: { id: 'destination', heading: 'Destination' },
  }),
  runLengthM: field({
    label: 'Run length',
    schema: z.number().min(0).max(100).nullable(),
    blank: null,
    parse: (text) => parseMeasure(text, RUN_LENGTH),
    format: numberText,
    show: withUnit('m'),
    csv: [{ header: 'run_length_m', label: 'Run length, m', write: (v) => v }],
    column: { id: 'runLength', heading: 'Run m' },
  }),
  loadCurrentA: field({
    label: 'Load current',
    schema: z.number().min(0).max(200).nullable(),
    blank: null,
    parse: (text) => parseMeasure(text, LOAD_CURRENT),
    format: numberText,
    show: withUnit('A'),
    csv: [{ header: 'load_current_a', label: 'Load current, A', write: (v) => v }],
    column: { id: 'load', heading: 'Load A' },
  }),
  driverType: field({
    inTemplate: true,
    label: 'Output stage',
    schema: z.enum(DRIVER_TYPES).nullable(),
    blank: null as DriverType | null,
    parse: parseDriverType,
    format: (v) => (v == null ? '' : DRIVER_TYPE_SHORT[v]),
    csv: [{ header: 'driver_type', label: 'ECU output stage', write: (v) => v }],
    column: { id: 'driverType', heading: 'Output' },
  }),
  driverRatedA: field({
    inTemplate: true,
    label: 'Output rating',
    schema: z.number().min(0.001).max(50).nullable(),
    blank: null,
    parse: (text) => parseMeasure(text, DRIVER_CURRENT),
    format: numberText,
    show: withUnit('A'),
    csv: [{ header: 'driver_rated_a', label: 'ECU output rating, A', write: (v) => v }],
    column: { id: 'driverRated', heading: 'Out. A' },
  }),
  pulseSignal: field({
    inTemplate: true,
    label: 'Pulse signal',
    schema: z.enum(PULSE_SIGNALS).nullable(),
    blank: null as PulseSignal | null,
    parse: parsePulseSignal,
    format: (v) => (v == null ? '' : PULSE_SIGNAL_LABELS[v]),
    csv: [{ header: 'pulse_signal', label: 'Pulse signal', write: (v) => v }],
    column: { id: 'pulseSignal', heading: 'Pulse' },
  }),
  pulsesPerRev: field({
    inTemplate: true,
    label: 'Pulses per rev or km',
    schema: z.number().min(0.1).max(100_000).nullable(),
    blank: null,
    parse: (text) => parseMeasure(text, PULSES_PER_REV),
    format: numberText,
    csv: [{ header: 'pulses_per_rev', label: 'Pulses per rev or km', write: (v) => v }],
    column: { id: 'pulsesPerRev', heading: 'Pulses' },
  }),
  terminationOhm: field({
    inTemplate: true,
    label: 'Bus termination',
    schema: z.number().min(1).max(100_000).nullable(),
    blank: null,
    parse: (text) => parseMeasure(text, TERMINATION_OHM),
    format: numberText,
    show: withUnit('Ω'),
    csv: [{ header: 'termination_ohm', label: 'Bus termination, Ω', write: (v) => v }],
    column: { id: 'termination', heading: 'Term. Ω' },
  }),
  notes: field({
    inTemplate: true,
    label: 'Notes',
    schema: noteText(2000),
    blank: '',
    parse: (text) => parseText(text, 2000, true),
    format: (v) => v,
    csv: [{ header: 'notes', label: 'Notes' }],
    column: { id: 'notes', heading: 'Notes' },
  }),
} satisfies FieldTable<PinValues>;

/** The fields a connector's pinout template in the library keeps. */
export type TemplatePinKey = TemplateKeyOf<typeof PIN_FIELDS>;
export const TEMPLATE_PIN_FIELDS = templateKeys<PinValues>(PIN_FIELDS) as TemplatePinKey[];

/** The grid columns the pin fields show in ("size", "destination"…). */
export type PinFieldColumnId = ColumnIdOf<typeof PIN_FIELDS>;
