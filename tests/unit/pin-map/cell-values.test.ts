import { describe, expect, it } from 'vitest';
import { awgAreaMm2 } from '../../../shared/domain/wire-sizes.ts';
import { parseDisposition, parseSignalClass } from '../../../shared/domain/fields/text-parsers.ts';
import {
  parseCell,
  parseDestination,
  type CellContext,
} from '../../../src/features/pin-map/lib/cell-values.ts';

const mm2: CellContext = {
  sizeUnit: 'mm2',
  destinations: [
    { pinId: 90, name: 'V1-3', function: 'Tachometer signal' },
    { pinId: 91, name: 'V1-4', function: 'Check-engine lamp' },
  ],
  feeds: [{ feedId: 7, name: 'ECU main' }],
};
const unlinked = { destination: '', destinationPinId: null, destinationFeedId: null };
const awg: CellContext = { ...mm2, sizeUnit: 'awg' };

const set = (result: ReturnType<typeof parseCell>) => (result.ok ? result.set : result.error);

describe('colour cells', () => {
  it('reads typed codes in any case and separator into the canonical form', () => {
    expect(set(parseCell('colour', 'bu/wh', mm2))).toEqual({ colour: 'BU/WH' });
    expect(set(parseCell('colour', 'BU-WH', mm2))).toEqual({ colour: 'BU/WH' });
    expect(set(parseCell('colour', ' rd ', mm2))).toEqual({ colour: 'RD' });
    // Green with a yellow stripe; only "GNYE" is IEC 60757's green-yellow (common practice).
    expect(set(parseCell('colour', 'gn/ye', mm2))).toEqual({ colour: 'GN/YE' });
    expect(set(parseCell('colour', 'gnye', mm2))).toEqual({ colour: 'GNYE' });
    // Service-literature abbreviations are read as IEC 60757 codes.
    expect(set(parseCell('colour', 'BLU/WHT', mm2))).toEqual({ colour: 'BU/WH' });
  });

  it('empties the colour on an empty cell', () => {
    expect(set(parseCell('colour', '', mm2))).toEqual({ colour: '' });
  });

  it('refuses what is not an IEC 60757 code, saying so', () => {
    const result = parseCell('colour', 'bluish', mm2);
    expect(result.ok).toBe(false);
    expect(result.ok ? '' : result.error).toMatch(/not a wire colour: use IEC 60757 codes/);
    expect(parseCell('colour', 'BU/BU', mm2).ok).toBe(false);
  });
});

describe('size cells', () => {
  it('reads mm² from the ISO 6722 series in a metric workshop', () => {
    expect(set(parseCell('size', '0.75', mm2))).toEqual({ sizeMm2: 0.75 });
    expect(set(parseCell('size', '1,5', mm2))).toEqual({ sizeMm2: 1.5 });
    expect(set(parseCell('size', '2.5 mm²', mm2))).toEqual({ sizeMm2: 2.5 });
  });

  it('refuses a metric size outside the series', () => {
    expect(parseCell('size', '0.8', mm2).ok).toBe(false);
  });

  it('reads gauges in an AWG workshop and stores their area in mm²', () => {
    const result = parseCell('size', '18', awg);
    expect(result.ok).toBe(true);
    expect(result.ok && result.set.sizeMm2).toBeCloseTo(awgAreaMm2(18), 3);
    expect(result.ok && result.set.sizeMm2).toBeCloseTo(0.8231, 3);
  });

  it('takes an explicit unit whatever the workshop uses', () => {
    expect(set(parseCell('size', '0.5 mm2', awg))).toEqual({ sizeMm2: 0.5 });
    const gauge = parseCell('size', '16 AWG', mm2);
    expect(gauge.ok && gauge.set.sizeMm2).toBeCloseTo(awgAreaMm2(16), 3);
  });

  it('refuses a gauge out of range and empties on an empty cell', () => {
    expect(parseCell('size', '40', awg).ok).toBe(false);
    expect(set(parseCell('size', '', awg))).toEqual({ sizeMm2: null });
  });
});

describe('disposition cells', () => {
  it.each([
    ['Keep as is', 'keep'],
    ['keep', 'keep'],
    ['Extend / reroute', 'extend'],
    ['ext', 'extend'],
    ['reroute', 'extend'],
    ['Join to vehicle circuit', 'join'],
    ['JOIN', 'join'],
    ['De-pin', 'depin'],
    ['depin', 'depin'],
    ['Cut and insulate', 'cut'],
    ['empty cavity', 'empty'],
    ['Undecided', 'undecided'],
    ['', 'undecided'],
  ])('reads "%s" as %s', (text, code) => {
    expect(parseDisposition(text)).toEqual({ ok: true, value: code });
  });

  it('refuses an unknown word and lists the choices', () => {
    const result = parseDisposition('remove');
    expect(result.ok).toBe(false);
    expect(result.ok ? '' : result.error).toMatch(/De-pin/);
  });
});

describe('signal class cells', () => {
  it('reads labels and codes; empty is "not set"', () => {
    expect(parseSignalClass('Sensor ground')).toEqual({ ok: true, value: 'sensor_ground' });
    expect(parseSignalClass('sensor_ground')).toEqual({ ok: true, value: 'sensor_ground' });
    expect(parseSignalClass('Shield / drain')).toEqual({ ok: true, value: 'shield' });
    expect(parseSignalClass('')).toEqual({ ok: true, value: 'none' });
    expect(parseSignalClass('analogue').ok).toBe(false);
  });
});

describe('number cells', () => {
  it('reads run length in metres with an optional unit and decimal comma', () => {
    expect(set(parseCell('runLength', '1.2', mm2))).toEqual({ runLengthM: 1.2 });
    expect(set(parseCell('runLength', '2,5 m', mm2))).toEqual({ runLengthM: 2.5 });
    expect(set(parseCell('runLength', '', mm2))).toEqual({ runLengthM: null });
  });

  it('reads load in amperes and refuses what is not a number or out of range', () => {
    expect(set(parseCell('load', '8 A', mm2))).toEqual({ loadCurrentA: 8 });
    expect(parseCell('load', 'eight', mm2).ok).toBe(false);
    expect(parseCell('load', '250', mm2).ok).toBe(false);
    expect(parseCell('load', '-1', mm2).ok).toBe(false);
  });

  it('reads insulation ratings that wire is sold in', () => {
    expect(set(parseCell('insulation', '105', mm2))).toEqual({ insulationRatingC: 105 });
    expect(set(parseCell('insulation', '125 °C', mm2))).toEqual({ insulationRatingC: 125 });
    expect(parseCell('insulation', '110', mm2).ok).toBe(false);
  });
});

describe('text and destination cells', () => {
  it('trims text and refuses text too long', () => {
    expect(set(parseCell('function', '  Injector 5 drive ', mm2))).toEqual({
      function: 'Injector 5 drive',
    });
    expect(parseCell('function', 'x'.repeat(201), mm2).ok).toBe(false);
  });

  it('links a destination that names a vehicle-side cavity and clears the text', () => {
    expect(parseDestination('v1-3', mm2.destinations, 5)).toEqual({
      ok: true,
      value: { ...unlinked, destinationPinId: 90 },
    });
    expect(parseDestination('→ V1-4', mm2.destinations, 5)).toEqual({
      ok: true,
      value: { ...unlinked, destinationPinId: 91 },
    });
  });

  it('keeps any other destination as free text and unlinks', () => {
    expect(set(parseCell('destination', 'Relay R1 terminal 85', mm2, 5))).toEqual({
      ...unlinked,
      destination: 'Relay R1 terminal 85',
    });
    expect(set(parseCell('destination', '', mm2, 5))).toEqual(unlinked);
  });

  it('joins a new feed named as "Feed: …", clearing the other two', () => {
    expect(set(parseCell('destination', 'feed: ecu main', mm2, 5))).toEqual({
      ...unlinked,
      destinationFeedId: 7,
    });
    // A feed that does not exist stays text.
    expect(set(parseCell('destination', 'Feed: Fan', mm2, 5))).toEqual({
      ...unlinked,
      destination: 'Feed: Fan',
    });
  });

  it('refuses a pin as its own destination', () => {
    expect(parseDestination('V1-3', mm2.destinations, 90).ok).toBe(false);
  });
});
