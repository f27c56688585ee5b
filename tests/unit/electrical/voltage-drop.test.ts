import { describe, expect, it } from 'vitest';
import {
  conductorLengthM,
  DROP_LIMIT_PCT,
  minSizeForDrop,
  voltageDrop,
} from '#shared/domain/electrical/voltage-drop.ts';
import { awgAreaMm2 } from '#shared/domain/wire-sizes.ts';

describe('conductor length of a run', () => {
  it('counts out and back on a two-wire circuit, the supply wire only on a chassis return', () => {
    // Common practice, no source.
    expect(conductorLengthM(20, 'wire')).toBe(40);
    expect(conductorLengthM(20, 'chassis')).toBe(20);
    expect(() => conductorLengthM(0, 'wire')).toThrow(RangeError);
  });
});

describe('voltage drop', () => {
  it('matches the published 12 V worked example', () => {
    // Worked example [V] (a published 12 V example, ρ = 0.01785): 16 AWG taken as 1.3 mm²,
    // 20 m one way, 1 A → 0.549 V = 4.58 %.
    const drop = voltageDrop({
      currentA: 1,
      runLengthM: 20,
      areaMm2: 1.3,
      returnPath: 'wire',
      systemV: 12,
      resistivityOhmMm2PerM: 0.01785,
      // The example works from the nominal area it names, not the J1128 minimum.
      awgAreaBasis: 'astm-b258-nominal',
    });
    expect(drop.conductorLengthM).toBe(40);
    expect(drop.voltageDropV).toBeCloseTo(0.549, 3);
    expect(drop.voltageDropPct).toBeCloseTo(4.58, 2);
    expect(drop.sources).toContain('common-practice');
  });

  it('uses IACS copper at the conductor temperature by default', () => {
    // [C] 10 A, 5 m two-wire, 1.5 mm², 20 °C: 10 × 0.017241 × 10 / 1.5 = 1.1494 V
    //     = 9.578 % of 12 V.
    const cold = voltageDrop({
      currentA: 10,
      runLengthM: 5,
      areaMm2: 1.5,
      returnPath: 'wire',
      systemV: 12,
    });
    expect(cold.voltageDropV).toBeCloseTo(1.1494, 4);
    expect(cold.voltageDropPct).toBeCloseTo(9.5783, 3);
    expect(cold.sources).toContain('iacs-copper');
    // [C] The same run at 60 °C: × (1 + 0.00393 × 40) = × 1.1572 → 1.33009 V.
    const warm = voltageDrop({
      currentA: 10,
      runLengthM: 5,
      areaMm2: 1.5,
      returnPath: 'wire',
      systemV: 12,
      conductorTempC: 60,
    });
    expect(warm.voltageDropV).toBeCloseTo(1.33009, 4);
    // [C] A chassis return counts half the conductor: half the drop.
    const chassis = voltageDrop({
      currentA: 10,
      runLengthM: 5,
      areaMm2: 1.5,
      returnPath: 'chassis',
      systemV: 12,
    });
    expect(chassis.voltageDropV).toBeCloseTo(cold.voltageDropV / 2, 9);
    expect(chassis.notes.join(' ')).toMatch(/Chassis return/);
  });

  it('gives the percentage of the system voltage', () => {
    // [C] Same drop, twice the system voltage: half the percentage.
    const run = { currentA: 5, runLengthM: 4, areaMm2: 1, returnPath: 'wire' as const };
    const at12 = voltageDrop({ ...run, systemV: 12 });
    const at24 = voltageDrop({ ...run, systemV: 24 });
    expect(at24.voltageDropV).toBe(at12.voltageDropV);
    expect(at24.voltageDropPct).toBeCloseTo(at12.voltageDropPct / 2, 9);
  });

  it('refuses a zero current or voltage', () => {
    const run = { runLengthM: 4, areaMm2: 1, returnPath: 'wire' as const };
    expect(() => voltageDrop({ ...run, currentA: 0, systemV: 12 })).toThrow(RangeError);
    expect(() => voltageDrop({ ...run, currentA: 1, systemV: 0 })).toThrow(RangeError);
  });
});

describe('drop limits', () => {
  it('are ABYC E-11’s', () => {
    // ABYC E-11: 3 % where drop must be kept to a minimum, 10 % for non-critical circuits.
    expect(DROP_LIMIT_PCT).toEqual({ critical: 3, general: 10 });
  });
});

describe('smallest size for a drop limit', () => {
  it('matches the marine-handbook worked example', () => {
    // Marine handbook [V]: 2.1 A lamp, 18 m, 0.6 V allowed, A = 2·L·I/(56·ΔV) → 2.25 mm²,
    // so 2.5 mm².
    expect((2 * 18 * 2.1) / (56 * 0.6)).toBeCloseTo(2.25, 9);
    const lamp = {
      currentA: 2.1,
      runLengthM: 18,
      returnPath: 'wire' as const,
      systemV: 12,
      dropLimitPct: (0.6 / 12) * 100, // 0.6 V of 12 V
      resistivityOhmMm2PerM: 1 / 56,
    };
    const size = minSizeForDrop({ ...lamp, series: 'mm2' });
    expect(size).toMatchObject({ areaMm2: 2.5, awg: null, label: '2.5 mm²' });
    // [C] The size below it, 2 mm², would drop 2 × 18 × 2.1 / (56 × 2) = 0.675 V > 0.6 V.
    const two = voltageDrop({ ...lamp, areaMm2: 2 });
    expect(two.voltageDropV).toBeCloseTo(0.675, 6);
  });

  it('picks from the AWG series too', () => {
    // [C] 10 A, 5 m two-wire, 12 V, 3 %: R ≤ 0.36 V / 10 A = 0.036 Ω over 10 m
    //     → A ≥ 0.017241 × 10 / 0.036 = 4.789 mm²: 6 mm² (4 mm² is too thin);
    //     AWG: 10 AWG cable is made to 9343 cmil = 4.734 mm² (SAE J1128 minimum), too thin, so
    //     8 AWG, the next size sold (odd gauges are never suggested).
    const run = {
      currentA: 10,
      runLengthM: 5,
      returnPath: 'wire' as const,
      systemV: 12,
      dropLimitPct: DROP_LIMIT_PCT.critical,
    };
    expect(minSizeForDrop({ ...run, series: 'mm2' })).toMatchObject({ areaMm2: 6, awg: null });
    const awg = minSizeForDrop({ ...run, series: 'awg' });
    expect(awg).toMatchObject({ awg: 8, label: '8 AWG' });
    expect(awg?.areaMm2).toBeCloseTo(awgAreaMm2(8), 9);
    expect(awg?.voltageDropPct).toBeLessThanOrEqual(3);
  });

  it('gives null when even the largest size fails', () => {
    // [C] 500 A over 100 m at 1 %: 70 mm² drops 500 × 0.017241 × 200 / 70 = 24.6 V; 4/0 AWG 16.1 V.
    const run = {
      currentA: 500,
      runLengthM: 100,
      returnPath: 'wire' as const,
      systemV: 12,
      dropLimitPct: 1,
    };
    expect(minSizeForDrop({ ...run, series: 'mm2' })).toBeNull();
    expect(minSizeForDrop({ ...run, series: 'awg' })).toBeNull();
  });

  it('gives the thinnest size when everything passes', () => {
    // [C] 0.01 A over 0.1 m at 10 %: even 0.22 mm² drops 0.01 × 0.017241 × 0.2 / 0.22 = 0.16 mV.
    const run = {
      currentA: 0.01,
      runLengthM: 0.1,
      returnPath: 'wire' as const,
      systemV: 12,
      dropLimitPct: 10,
    };
    expect(minSizeForDrop({ ...run, series: 'mm2' })?.areaMm2).toBe(0.22);
    // The thinnest AWG cable sold is 22 (common practice, no source).
    expect(minSizeForDrop({ ...run, series: 'awg' })?.awg).toBe(22);
  });

  // ABYC E-11 Table IX, 12 V, 3 %, as transcribed (references.md, [V] secondary): built on SAE J1128
  // minimum areas with K = 10.75 Ω·cmil/ft, copper a little above 20 °C. Worked here at 30 °C, the
  // ambient Table 5 assumes outside engine spaces (K = 10.371 × 1.0393 = 10.78 Ω·cmil/ft).
  it.each([
    // [current A, round-trip length ft, published gauge]
    [10, 20, 10],
    [20, 25, 6],
  ])('reproduces Table IX: %i A over %i ft round trip → %i AWG', (currentA, roundTripFt, gauge) => {
    const size = minSizeForDrop({
      currentA,
      runLengthM: (roundTripFt / 2) * 0.3048,
      returnPath: 'wire',
      conductorTempC: 30,
      systemV: 12,
      dropLimitPct: 3,
      series: 'awg',
    });
    expect(size?.awg).toBe(gauge);
  });

  it('names only sizes that are sold, never an odd gauge', () => {
    for (const currentA of [0.5, 2, 5, 8, 12, 15, 25, 40, 60, 100, 150]) {
      for (const runLengthM of [0.5, 1, 2, 4, 8]) {
        const size = minSizeForDrop({
          currentA,
          runLengthM,
          returnPath: 'wire',
          systemV: 12,
          dropLimitPct: 3,
          series: 'awg',
        });
        if (!size) continue;
        // Even gauges 22 … 2, then 1, 1/0 … 4/0 (gauge 0 … −3), common practice.
        expect(size.awg! % 2 === 0 || size.awg! <= 1).toBe(true);
        expect(size.label).not.toMatch(/≈/);
      }
    }
  });
});
