import { describe, expect, it } from 'vitest';
import { benchItems, continuityLooksHigh, expectedContinuityOhm } from '#shared/domain/bench.ts';
import { snapshot } from '../../factories/snapshot.factory.ts';

describe('continuity readings', () => {
  it('expects the wire’s own resistance from size and run length', () => {
    // 0.017241 Ω·mm²/m × 2 m / 0.5 mm² = 0.0690 Ω at 20 °C (IEC 60028 / IACS copper) [C].
    expect(expectedContinuityOhm({ sizeMm2: 0.5, runLengthM: 2 })).toBeCloseTo(0.06896, 4);
    expect(expectedContinuityOhm({ sizeMm2: null, runLengthM: 2 })).toBeNull();
    expect(expectedContinuityOhm({ sizeMm2: 0.5, runLengthM: null })).toBeNull();
  });

  it('flags a reading above the wire plus 0.2 Ω (common practice, no source)', () => {
    expect(continuityLooksHigh(0.15, null)).toBe(false);
    expect(continuityLooksHigh(0.25, null)).toBe(true);
    expect(continuityLooksHigh(0.25, 0.069)).toBe(false);
    expect(continuityLooksHigh(0.3, 0.069)).toBe(true);
  });
});

describe('bench order', () => {
  it('puts de-pin first, then cut, extend, join, keep, and leaves out empty cavities', () => {
    const s = snapshot({
      pins: [
        { disposition: 'keep' },
        { disposition: 'join' },
        { disposition: 'empty' },
        { disposition: 'depin' },
        { disposition: 'cut' },
        { disposition: 'extend' },
      ],
    });
    expect(benchItems(s).map((i) => i.pin.disposition)).toEqual([
      'depin',
      'cut',
      'extend',
      'join',
      'keep',
    ]);
  });
});
