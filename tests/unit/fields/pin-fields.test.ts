import fc from 'fast-check';
import { DRIVER_TYPES } from '#shared/domain/electrical/relays.ts';
import { PULSE_SIGNALS } from '#shared/domain/fields/text-parsers.ts';
import { describe, expect, it } from 'vitest';
import {
  blankRecord,
  fieldKeys,
  type FieldSpec,
} from '../../../shared/domain/fields/field-table.ts';
import { PIN_FIELDS, type PinValues } from '../../../shared/domain/fields/pin-fields.ts';
import { DISPOSITIONS } from '../../../shared/domain/dispositions.ts';
import { SIGNAL_CLASSES } from '../../../shared/domain/signal-classes.ts';
import { COLOUR_CODES } from '../../../shared/domain/wire-colours.ts';
import {
  AWG_GAUGES,
  ISO_6722_SIZES_MM2,
  storedAwgAreaMm2,
  WIRE_SIZES_MM2,
} from '../../../shared/domain/wire-sizes.ts';
import { BLANK_PIN_VALUES, PinFields } from '../../../shared/schemas/pin-map.schema.ts';
import { INSULATION_RATINGS_C, SIZE_UNITS } from '../../../shared/schemas/workshop.schema.ts';

const orNull = <T>(arb: fc.Arbitrary<T>) => fc.option(arb, { nil: null });
const colourCode = fc.constantFrom(...COLOUR_CODES);
const typedCase = (code: fc.Arbitrary<string>) =>
  fc.tuple(code, fc.boolean()).map(([c, lower]) => (lower ? c.toLowerCase() : c));

/** A size within 1 % of an accepted one, as an older import or a hand-made request may carry it. */
const nearSize = fc
  .tuple(fc.constantFrom(...WIRE_SIZES_MM2), fc.double({ min: -0.0099, max: 0.0099, noNaN: true }))
  .map(([size, off]) => size * (1 + off));

/**
 * Inputs to try for each field: anything, including what the schema refuses; the property is
 * checked for the values the schema accepts. A field added to the table without inputs here fails
 * the "every field" test below.
 */
const INPUTS: { [K in keyof PinValues]: fc.Arbitrary<unknown> } = {
  function: fc.string({ maxLength: 220, unit: 'binary' }),
  signalClass: fc.constantFrom(...SIGNAL_CLASSES),
  colour: fc.oneof(
    fc.constant(''),
    typedCase(colourCode),
    typedCase(fc.tuple(colourCode, colourCode).map(([a, b]) => `${a}/${b}`)),
    fc.string({ maxLength: 22 }),
  ),
  sizeMm2: orNull(
    fc.oneof(fc.constantFrom(...WIRE_SIZES_MM2), nearSize, fc.double({ min: 0, max: 130 })),
  ),
  insulationRatingC: orNull(fc.oneof(fc.constantFrom(...INSULATION_RATINGS_C), fc.integer())),
  disposition: fc.constantFrom(...DISPOSITIONS),
  destination: fc.string({ maxLength: 220, unit: 'binary' }),
  destinationPinId: orNull(fc.integer({ min: -5, max: Number.MAX_SAFE_INTEGER })),
  destinationFeedId: orNull(fc.integer({ min: -5, max: Number.MAX_SAFE_INTEGER })),
  runLengthM: orNull(fc.double({ min: -1, max: 120, noNaN: true })),
  loadCurrentA: orNull(fc.double({ min: -1, max: 250, noNaN: true })),
  driverType: orNull(fc.constantFrom(...DRIVER_TYPES)),
  driverRatedA: orNull(fc.double({ min: -1, max: 60, noNaN: true })),
  pulseSignal: orNull(fc.constantFrom(...PULSE_SIGNALS)),
  pulsesPerRev: orNull(fc.double({ min: 0, max: 200_000, noNaN: true })),
  terminationOhm: orNull(fc.double({ min: 0, max: 200_000, noNaN: true })),
  notes: fc.string({ maxLength: 2100, unit: 'binary' }),
};

describe('the pin field table', () => {
  it('has inputs for the property test for every field', () => {
    expect(Object.keys(INPUTS).sort()).toEqual(fieldKeys(PIN_FIELDS).sort());
  });

  for (const key of fieldKeys(PIN_FIELDS)) {
    const spec = PIN_FIELDS[key] as FieldSpec<unknown>;
    it(`${key}: parse(format(v)) gives v back for every value the schema accepts, in both units`, () => {
      fc.assert(
        fc.property(INPUTS[key], fc.constantFrom(...SIZE_UNITS), (input, unit) => {
          const accepted = spec.schema.safeParse(input);
          fc.pre(accepted.success);
          const value = accepted.data;
          const back = spec.parse(spec.format(value, unit), unit);
          return back.ok && back.value === value;
        }),
        { numRuns: 400 },
      );
    });
  }

  it('round-trips every accepted wire size in both units, each one shown as its own series', () => {
    for (const size of WIRE_SIZES_MM2) {
      for (const unit of SIZE_UNITS) {
        const text = PIN_FIELDS.sizeMm2.format(size, unit);
        expect(PIN_FIELDS.sizeMm2.parse(text, unit)).toEqual({ ok: true, value: size });
      }
    }
    // A metric size in an AWG workshop keeps its own unit instead of the nearest gauge.
    expect(PIN_FIELDS.sizeMm2.format(4, 'awg')).toBe('4 mm²');
    expect(PIN_FIELDS.sizeMm2.format(storedAwgAreaMm2(18), 'mm2')).toBe('18 AWG');
  });

  it('accepts one set of sizes: the ISO 6722 series and the AWG series, nothing else', () => {
    expect(WIRE_SIZES_MM2).toHaveLength(ISO_6722_SIZES_MM2.length + AWG_GAUGES.length);
    // 0.8 mm² is within 3 % of 18 AWG (0.823 mm²) but is neither series' size.
    expect(PinFields.shape.sizeMm2.safeParse(0.8).success).toBe(false);
    // An area within 1 % of a size is read as that size.
    expect(PinFields.shape.sizeMm2.parse(0.823)).toBe(storedAwgAreaMm2(18));
  });

  it('gives the blank pin from the table', () => {
    expect(BLANK_PIN_VALUES).toEqual(blankRecord(PIN_FIELDS));
    expect(PinFields.parse(BLANK_PIN_VALUES)).toEqual(BLANK_PIN_VALUES);
  });
});
