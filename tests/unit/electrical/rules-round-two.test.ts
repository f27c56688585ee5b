import { describe, expect, it } from 'vitest';
import {
  AMBIENT_C,
  estimateConductorTemp,
} from '#shared/domain/electrical/conductor-temperature.ts';
import {
  DEFAULT_DROP_ALLOWANCES,
  DROP_ALLOWANCE_SOURCES,
  dropBudget,
} from '#shared/domain/electrical/drop-budget.ts';
import {
  familyForLoad,
  FUSE_FAMILIES,
  fuseColour,
  fusePlacement,
  recommendedFuseA,
  UNFUSED_LENGTH_LIMIT_MM,
} from '#shared/domain/electrical/fuses.ts';
import {
  coilCurrentA,
  contactRatingNeededA,
  INRUSH_ALLOWANCE,
  outputCarries,
} from '#shared/domain/electrical/relays.ts';

describe('conductor temperature under load (FAA AC 43.13-1B ¶11-66)', () => {
  it('starts from the ambient Table 5 assumes', () => {
    // 33 CFR 183.425 Table 5: 30 °C outside engine spaces; note 1 takes it to 50 °C inside.
    expect(AMBIENT_C).toEqual({ cabin: 30, engine_bay: 50 });
  });

  it('reaches the insulation rating at the allowable current and rises with its square', () => {
    const at = (currentA: number) =>
      estimateConductorTemp({ ambientC: 30, insulationRatingC: 105, currentA, ampacityA: 20 })
        .conductorTempC;
    // [C] T = T1 + (TR − T1)(I/Imax)²: I = Imax → 105 °C; I = Imax/2 → 30 + 75/4 = 48.75 °C.
    expect(at(20)).toBe(105);
    expect(at(10)).toBe(48.75);
    expect(at(0)).toBe(30);
  });

  it('shows the formula with its numbers', () => {
    const t = estimateConductorTemp({
      ambientC: 50,
      insulationRatingC: 105,
      currentA: 8,
      ampacityA: 16,
    });
    // [C] 50 + 55 × 0.25 = 63.75 °C
    expect(t.working).toMatch(/50 \+ \(105 − 50\) × \(8 \/ 16\)² = 63\.8 °C/);
  });
});

describe('drop budget', () => {
  it('has defaults, each with its source or marked common practice / from memory', () => {
    expect(DEFAULT_DROP_ALLOWANCES).toEqual({
      fuseV: 0.1, // at the fuse's rating; from memory: blade-fuse datasheets list about 0.1 V
      relayContactsV: 0.1, // at the contact rating; common practice, no source
      perConnectionV: 0.005, // common practice, no source
      chassisReturnV: 0.05, // common practice, no source
    });
    expect(DROP_ALLOWANCE_SOURCES.fuseV).toBe('from-memory');
    expect(DROP_ALLOWANCE_SOURCES.chassisReturnV).toBe('common-practice');
  });

  it('adds copper, fuse, relay, terminals and return path against the limit', () => {
    // [C] 0.2 V copper + 15 A fuse at 10 A: 0.1 × 10/15 = 0.0667 V + 30 A contacts at 10 A:
    //     0.1 × 10/30 = 0.0333 V + 4 × 0.005 V + chassis 0.05 V = 0.37 V = 3.08 % > 3 % (0.36 V).
    const b = dropBudget({
      copperV: 0.2,
      fuses: [{ ratingA: 15, currentA: 10 }],
      relays: [{ ratingA: 30, currentA: 10 }],
      connections: 4,
      returnPath: 'chassis',
      allowances: DEFAULT_DROP_ALLOWANCES,
      systemV: 12,
      limitPct: 3,
    });
    expect(b.totalV).toBeCloseTo(0.37, 9);
    expect(b.limitV).toBeCloseTo(0.36, 9);
    expect(b.withinLimit).toBe(false);
    // [C] copper may take 0.36 − 0.17 = 0.19 V.
    expect(b.copperAllowanceV).toBeCloseTo(0.19, 9);
    expect(b.lines.map((l) => l.label)).toEqual([
      'Wire of this feed',
      'Fuse 15 A at 10 A: 0.1 V × 10 / 15',
      'Relay contacts 30 A at 10 A: 0.1 V × 10 / 30',
      '4 × terminal or splice at 0.005 V',
      'Chassis return',
    ]);
  });

  it('leaves out the chassis on a two-wire circuit', () => {
    // [C] 0.1 + 0.1 × 15/15 = 0.2 V ≤ 0.36 V
    const b = dropBudget({
      copperV: 0.1,
      fuses: [{ ratingA: 15, currentA: 15 }],
      relays: [],
      connections: 0,
      returnPath: 'wire',
      allowances: DEFAULT_DROP_ALLOWANCES,
      systemV: 12,
      limitPct: 3,
    });
    expect(b.totalV).toBeCloseTo(0.2, 9);
    expect(b.withinLimit).toBe(true);
  });
});

describe('fuse families', () => {
  it('keeps each family’s own ratings and colours', () => {
    // Standard blades, industry charts [V]: 15 blue, 40 orange.
    expect(fuseColour(15)).toBe('blue');
    expect(fuseColour(40, 'standard_blade')).toBe('orange');
    // Maxi blades use their own colour table (from memory): 60 A blue, 50 A red.
    expect(fuseColour(60, 'maxi_blade')).toBe('blue');
    expect(fuseColour(50, 'maxi_blade')).toBe('red');
    // Mini blades stop at 30 A; bolt-down strips and fusible links carry no colour code.
    expect(FUSE_FAMILIES.mini_blade.ratings.at(-1)?.ratingA).toBe(30);
    expect(fuseColour(100, 'bolt_down')).toBeNull();
    expect(FUSE_FAMILIES.fusible_link.ratings).toHaveLength(0);
  });

  it('applies the 125 % rule in every family (NEC 210.20(A))', () => {
    // [C] 1.25 × 20 = 25 A: standard 25 A; mini 25 A; maxi 30 A; bolt-down 40 A.
    expect(recommendedFuseA(20, 0, 'standard_blade')).toBe(25);
    expect(recommendedFuseA(20, 0, 'mini_blade')).toBe(25);
    expect(recommendedFuseA(20, 0, 'maxi_blade')).toBe(30);
    expect(recommendedFuseA(20, 0, 'bolt_down')).toBe(40);
    // [C] 1.25 × 30 = 37.5 A: above the largest mini (30 A).
    expect(recommendedFuseA(30, 0, 'mini_blade')).toBeNull();
    // [C] 1.25 × 90 = 112.5 A: past the maxi blades, a 125 A bolt-down strip.
    expect(familyForLoad(90)).toEqual({ type: 'bolt_down', ratingA: 125 });
  });

  it('places the fuse within 178 mm of the source, 1,016 mm when sheathed (33 CFR 183.455(b))', () => {
    expect(UNFUSED_LENGTH_LIMIT_MM).toEqual({ bare: 178, sheathed: 1016 });
    expect(fusePlacement(300, false)).toEqual({ limitMm: 178, withinLimit: false });
    expect(fusePlacement(150, false).withinLimit).toBe(true);
    expect(fusePlacement(900, true).withinLimit).toBe(true);
  });
});

describe('relays and the outputs that drive them', () => {
  it('allows for inrush: motor × 2, lamp × 3 (common practice, no source)', () => {
    expect(INRUSH_ALLOWANCE).toEqual({ resistive: 1, motor: 2, lamp: 3 });
    // [C] 10 A resistive + 8 A motor × 2 + 2 A lamp × 3 = 32 A
    expect(
      contactRatingNeededA([
        { currentA: 10 },
        { currentA: 8, kind: 'motor' },
        { currentA: 2, kind: 'lamp' },
      ]),
    ).toBe(32);
  });

  it('works the coil current from its resistance (Ohm’s law)', () => {
    // [C] 12 V / 60 Ω = 0.2 A ≤ a 0.5 A low-side output; 12 V / 80 Ω = 0.15 A.
    expect(coilCurrentA(12, 60)).toBeCloseTo(0.2, 12);
    expect(coilCurrentA(12, 80)).toBeCloseTo(0.15, 12);
    expect(outputCarries(0.5, coilCurrentA(12, 60))).toBe(true);
    expect(outputCarries(0.5, 8)).toBe(false);
  });
});
