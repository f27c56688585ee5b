import { describe, expect, it } from 'vitest';
import {
  colourSwatches,
  COLOUR_CODES,
  describeWireColour,
  parseWireColour,
} from '#shared/domain/wire-colours.ts';

describe('IEC 60757 wire colours', () => {
  it('knows the fourteen two-letter codes', () => {
    // IEC 60757 codes (../shared/references.md): BK BN RD OG YE GN BU VT GY WH PK TQ GD SR.
    expect([...COLOUR_CODES].sort()).toEqual(
      ['BK', 'BN', 'RD', 'OG', 'YE', 'GN', 'BU', 'VT', 'GY', 'WH', 'PK', 'TQ', 'GD', 'SR'].sort(),
    );
  });

  it.each([
    ['BU/WH', 'BU/WH'],
    ['bu/wh', 'BU/WH'],
    ['BU-WH', 'BU/WH'],
    ['bu wh', 'BU/WH'],
    [' rd ', 'RD'],
    ['GNYE', 'GNYE'],
    // Green with a yellow stripe is an ordinary vehicle wire; only "GNYE" is IEC 60757's
    // green-yellow (common practice, references.md).
    ['gn/ye', 'GN/YE'],
    ['GN-YE', 'GN/YE'],
    // Common English abbreviations from service literature (common practice, no source).
    ['BLU/WHT', 'BU/WH'],
    ['BLK', 'BK'],
    ['grn/yel', 'GN/YE'],
    ['ORN', 'OG'],
    ['BRN/WHT', 'BN/WH'],
    ['GRY', 'GY'],
    ['PNK', 'PK'],
    ['VIO', 'VT'],
    ['PPL/RED', 'VT/RD'],
    ['Blue', 'BU'],
    ['LT GRN', 'GN'],
    ['dk blu/wht', 'BU/WH'],
  ])('reads %j as %s', (input, value) => {
    const parsed = parseWireColour(input);
    expect(parsed.ok && parsed.value).toBe(value);
  });

  it('says when a shade is dropped, as IEC 60757 has none', () => {
    const parsed = parseWireColour('LT GRN/BLK');
    expect(parsed.ok && parsed.note).toMatch(/no light green: stored as GN/);
    expect(parsed.ok && parsed.value).toBe('GN/BK');
  });

  it.each(['BLUISH', 'BU/XX', 'BU/BU', 'BLU/BLUE', 'BU/WH/RD', ''])(
    'refuses %j with the allowed codes',
    (input) => {
      const parsed = parseWireColour(input);
      expect(parsed.ok).toBe(false);
    },
  );

  it('names the allowed codes in the error', () => {
    const parsed = parseWireColour('LB');
    expect(!parsed.ok && parsed.error).toMatch(/IEC 60757.*BK, BN, RD/);
  });

  it('describes and draws a colour', () => {
    expect(describeWireColour('BU/WH')).toBe('blue with white stripe');
    expect(describeWireColour('GNYE')).toBe('green-yellow');
    expect(colourSwatches('BU/WH')).toHaveLength(2);
    expect(colourSwatches('')).toEqual([]);
  });
});
