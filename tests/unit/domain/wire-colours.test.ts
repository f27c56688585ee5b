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
    ['gn/ye', 'GNYE'],
  ])('reads %j as %s', (input, value) => {
    const parsed = parseWireColour(input);
    expect(parsed.ok && parsed.value).toBe(value);
  });

  it.each(['BLUE', 'BU/XX', 'BU/BU', 'BU/WH/RD', ''])(
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
