import { describe, expect, it } from 'vitest';
import {
  BLADE_FUSE_RATINGS_A,
  BLADE_FUSES,
  fuseColour,
  fuseProtectsWire,
  FUSE_PROTECTS_WIRE_NOTE,
  isStandardFuseRating,
  recommendedFuseA,
  smallestWireForFuse,
} from '#shared/domain/electrical/fuses.ts';
import { awgAreaMm2 } from '#shared/domain/wire-sizes.ts';

describe('blade fuses', () => {
  // Industry charts (ISO 8820-3's own table not read); 35 A blue-green from memory.
  it.each([
    [1, 'black'],
    [2, 'grey'],
    [3, 'violet'],
    [4, 'pink'],
    [5, 'tan'],
    [7.5, 'brown'],
    [10, 'red'],
    [15, 'blue'],
    [20, 'yellow'],
    [25, 'clear/white'],
    [30, 'green'],
    [35, 'blue-green'], // from memory
    [40, 'orange'],
  ])('%f A is %s', (ratingA, colour) => {
    expect(fuseColour(ratingA)).toBe(colour);
    expect(isStandardFuseRating(ratingA)).toBe(true);
  });

  it('lists the standard ratings in order and marks the colour from memory', () => {
    expect(BLADE_FUSE_RATINGS_A).toEqual([1, 2, 3, 4, 5, 7.5, 10, 15, 20, 25, 30, 35, 40]);
    expect(BLADE_FUSES.filter((f) => f.fromMemory).map((f) => f.ratingA)).toEqual([35]);
    expect(fuseColour(6)).toBeNull();
    expect(isStandardFuseRating(50)).toBe(false);
  });
});

describe('fuse for the load', () => {
  // NEC 210.20(A): rating ≥ 125 % of the continuous load; common practice in vehicle work.
  it.each([
    [12, 15], // references.md [C]: 1.25 × 12 = 15 → 15 A
    [16, 20], // [C] 1.25 × 16 = 20 → 20 A
    [8, 10], // [C] 1.25 × 8 = 10 → 10 A
    [32, 40], // [C] 1.25 × 32 = 40 → 40 A
    [6, 7.5], // [C] 1.25 × 6 = 7.5 → 7.5 A
    [12.5, 20], // [C] 1.25 × 12.5 = 15.625 → 20 A
    [0.8, 1], // [C] 1.25 × 0.8 = 1 → 1 A
  ])('%f A continuous → %f A', (continuousA, fuseA) => {
    expect(recommendedFuseA(continuousA)).toBe(fuseA);
  });

  it('is null above 40 A', () => {
    // [C] 1.25 × 33 = 41.25 A > 40 A, the largest blade rating.
    expect(recommendedFuseA(33)).toBeNull();
  });

  it('adds a non-continuous load at 100 %', () => {
    // [C] NEC 210.20(A): 1.25 × 8 + 5 = 15 → 15 A; 1.25 × 8 + 5.5 = 15.5 → 20 A.
    expect(recommendedFuseA(8, 5)).toBe(15);
    expect(recommendedFuseA(8, 5.5)).toBe(20);
    expect(recommendedFuseA(0, 3)).toBe(3);
    // [C] 1.25 × 2.24 + 0.2 = 3 exactly, 3.0000000000000004 in floating point: still 3 A.
    expect(1.25 * 2.24 + 0.2).toBeGreaterThan(3);
    expect(recommendedFuseA(2.24, 0.2)).toBe(3);
  });

  it('refuses a negative or zero load', () => {
    expect(() => recommendedFuseA(-1)).toThrow(RangeError);
    expect(() => recommendedFuseA(0)).toThrow(RangeError);
  });
});

describe('fuse protects the wire', () => {
  it('allows a fuse up to the derated ampacity, not over it', () => {
    // NEC 240.4: the device must not exceed the conductor's ampacity.
    expect(fuseProtectsWire(15, 15)).toBe(true);
    expect(fuseProtectsWire(15, 17)).toBe(true);
    expect(fuseProtectsWire(20, 17.85)).toBe(false);
    expect(fuseProtectsWire(20, 19.999)).toBe(false);
    expect(FUSE_PROTECTS_WIRE_NOTE).toMatch(/183\.455\(c\).*150 %/);
  });
});

describe('smallest wire for a fuse', () => {
  it('picks a metric size by the metric rule', () => {
    // [C] 20 A, 105 °C, engine bay: 1 mm² rates as 18 AWG → 20 × 0.85 = 17 A (too little);
    //     1.5 mm² rates as 16 AWG → 25 × 0.85 = 21.25 A.
    const wire = smallestWireForFuse({
      fuseA: 20,
      insulationRatingC: 105,
      zone: 'engine_bay',
      series: 'mm2',
    });
    expect(wire).toMatchObject({ areaMm2: 1.5, awg: null, label: '1.5 mm²', extrapolated: false });
    expect(wire?.ampacityA).toBeCloseTo(21.25, 9);
    expect(wire?.sources).toEqual(expect.arrayContaining(['uscg-183-425', 'nec-240-4']));
  });

  it('picks an AWG gauge, by the column rule for 85 °C insulation', () => {
    // [C] 30 A, GPT 85 °C (80 °C column), cabin: 14 AWG 25 A, 13 AWG (14 row) 25 A, 12 AWG 35 A.
    expect(
      smallestWireForFuse({ fuseA: 30, insulationRatingC: 85, zone: 'cabin', series: 'awg' }),
    ).toMatchObject({ awg: 12, label: '12 AWG', ampacityA: 35 });
  });

  it('honours bundle derating when asked', () => {
    // [C] 40 A, 105 °C, engine bay, 7 bundled: × 0.85 × 0.5 = × 0.425;
    //     8 AWG 80 × 0.425 = 34 A (too little), 7 AWG (8 row) 34 A, 6 AWG 120 × 0.425 = 51 A.
    const wire = smallestWireForFuse({
      fuseA: 40,
      insulationRatingC: 105,
      zone: 'engine_bay',
      bundled: 7,
      applyBundleDerating: true,
      series: 'awg',
    });
    expect(wire?.awg).toBe(6);
    expect(wire?.ampacityA).toBeCloseTo(51, 9);
    expect(wire?.areaMm2).toBeCloseTo(awgAreaMm2(6), 9);
  });

  it('flags a size thinner than 18 AWG as extrapolated', () => {
    // [C] 15 A, 105 °C, cabin: 0.5 mm² scales to 12.15 A, 0.75 mm² to 18.22 A (common practice).
    const wire = smallestWireForFuse({
      fuseA: 15,
      insulationRatingC: 105,
      zone: 'cabin',
      series: 'mm2',
    });
    expect(wire).toMatchObject({ areaMm2: 0.75, extrapolated: true });
  });

  it('gives null when even the thickest size is rated too low', () => {
    // [C] 200 A, 60 °C, engine bay: the largest row, 4 AWG, gives 105 × 0.58 = 60.9 A.
    for (const series of ['mm2', 'awg'] as const) {
      expect(
        smallestWireForFuse({ fuseA: 200, insulationRatingC: 60, zone: 'engine_bay', series }),
      ).toBeNull();
    }
  });
});
