import { describe, expect, it } from 'vitest';
import { runCircuitCalc } from '#shared/domain/electrical/circuit-calc.ts';
import { SOURCES } from '#shared/domain/electrical/sources.ts';
import { CalcRequest, type CalcRequestInput } from '#shared/schemas/calc.schema.ts';
import { awgAreaMm2 } from '#shared/domain/wire-sizes.ts';

const calc = (input: CalcRequestInput) => runCircuitCalc(CalcRequest.parse(input));

const BASE = {
  currentA: 12,
  lengthM: 3,
  systemV: 12,
  returnPath: 'wire',
  sizeMm2: 1,
} as const;

describe('stateless circuit calculator', () => {
  it('works one circuit through', () => {
    const r = calc({ ...BASE, fuseA: 15, dropLimitPct: 3 });
    // [C] FAA AC 43.13-1B ¶11-66: 30 °C ambient (Table 5, cabin), 12 A of the 20 A allowed at
    //     105 °C: T = 30 + 75 × (12/20)² = 57 °C, × (1 + 0.00393 × 37) = 1.14541.
    //     2 × 3 m = 6 m; R = 0.017241 × 6 / 1 × 1.14541 = 0.118488 Ω; ΔV = 12 × R = 1.42186 V.
    expect(r.areaMm2).toBe(1);
    expect(r.ambientC).toBe(30);
    expect(r.conductorTempC).toBeCloseTo(57, 9);
    expect(r.conductorTempEstimated).toBe(true);
    expect(r.conductorLengthM).toBe(6);
    expect(r.resistanceOhm).toBeCloseTo(0.118488, 5);
    expect(r.voltageDropV).toBeCloseTo(1.42186, 4);
    expect(r.voltageDropPct).toBeCloseTo(11.849, 2);
    expect(r.dropWithinLimit).toBe(false);
    // 1 mm² rates as 18 AWG; Table 5, 18 AWG, 105 °C: 20 A; no derating in the cabin.
    expect(r.tableAwg).toBe(18);
    expect(r.ampacityA).toBe(20);
    expect(r.deratingFactor).toBe(1);
    expect(r.currentWithinAmpacity).toBe(true);
    // NEC 240.4: 15 A ≤ 20 A. NEC 210.20(A): 1.25 × 12 = 15 → 15 A (blue, industry charts).
    expect(r.fuseProtectsWire).toBe(true);
    expect(r.fuseColour).toBe('blue');
    expect(r.recommendedFuseA).toBe(15);
    expect(r.recommendedFuseColour).toBe('blue');
    // [C] 3 % = 0.36 V, R ≤ 0.03 Ω, each size at its own temperature:
    //     2.5 mm² (14 AWG row, 35 A): 38.8 °C, R = 0.04444 Ω, too much; 4 mm² (12 AWG row, 45 A):
    //     35.3 °C, R = 0.02742 Ω → 4 mm².
    //     AWG at SAE J1128 minimum areas: 12 AWG (5833 cmil = 2.956 mm²) 0.0371 Ω, too much;
    //     10 AWG (9343 cmil) → 10 AWG. Odd gauges are never suggested.
    expect(r.minSizeForDrop?.mm2).toMatchObject({ areaMm2: 4, label: '4 mm²' });
    expect(r.minSizeForDrop?.awg).toMatchObject({ awg: 10, label: '10 AWG' });
    expect(r.notes.join('\n')).toMatch(
      /Conductor temperature 30 \+ \(105 − 30\) × \(12 \/ 20\)² = 57 °C/,
    );
    // [C] 15 A, 105 °C, cabin, mm² series: 0.75 mm² scales to 18.22 A (common practice).
    expect(r.smallestWireForFuse).toMatchObject({ areaMm2: 0.75, extrapolated: true });
    const ids = r.sources.map((s) => s.id);
    expect(ids).toEqual(
      expect.arrayContaining([
        'iacs-copper',
        'uscg-183-425',
        'nec-210-20',
        'nec-240-4',
        'abyc-e11',
      ]),
    );
    expect(new Set(ids).size).toBe(ids.length);
    for (const s of r.sources) expect(s).toEqual({ id: s.id, ...SOURCES[s.id] });
    expect(r.notes.join('\n')).toMatch(/1\.25 × 12 A = 15 A → 15 A/);
  });

  it('leaves out the fuse check and the size search when not asked', () => {
    const r = calc(BASE);
    expect(r).not.toHaveProperty('fuseProtectsWire');
    expect(r).not.toHaveProperty('fuseColour');
    expect(r).not.toHaveProperty('minSizeForDrop');
    expect(r).not.toHaveProperty('dropWithinLimit');
    expect(r.sources.map((s) => s.id)).not.toContain('nec-240-4');
    // The smallest wire is then for the recommended fuse, 15 A.
    expect(r.smallestWireForFuse?.areaMm2).toBe(0.75);
  });

  it('takes an AWG size and answers in AWG', () => {
    const { sizeMm2: _omit, ...rest } = BASE;
    const r = calc({ ...rest, awg: '16', fuseA: 20, zone: 'engine_bay' });
    expect(r.areaMm2).toBeCloseTo(awgAreaMm2(16), 3);
    expect(r.sizeLabel).toBe('16 AWG');
    // Published engine-space value for 105 °C 16 AWG is 21 A; [C] 25 × 0.85 = 21.25 A.
    expect(r.ampacityA).toBeCloseTo(21.25, 9);
    expect(r.fuseProtectsWire).toBe(true);
    // [C] 20 A in the engine bay, sold AWG sizes: 18 AWG 17 A, 16 AWG 21.25 A.
    expect(r.smallestWireForFuse).toMatchObject({ awg: 16, label: '16 AWG' });
  });

  it('derates for a bundle of three or more and flags a fuse that does not protect', () => {
    // [C] 1.5 mm² → 16 AWG row, 25 A × 0.85 (engine bay) × 0.60 (4 bundled) = 12.75 A < 15 A fuse.
    const r = calc({ ...BASE, sizeMm2: 1.5, zone: 'engine_bay', bundled: 4, fuseA: 15 });
    expect(r.bundleFactor).toBe(0.6);
    expect(r.deratingFactor).toBeCloseTo(0.51, 9);
    expect(r.ampacityA).toBeCloseTo(12.75, 9);
    expect(r.fuseProtectsWire).toBe(false);
    expect(r.currentWithinAmpacity).toBe(true);
    expect(r.notes.join('\n')).toMatch(/does NOT protect/);
    expect(r.sources.map((s) => s.id)).toContain('uscg-183-435');
  });

  it('says when the load is beyond blade fuses and the wire', () => {
    // [C] 1.25 × 33 = 41.25 A > 40 A; 33 A > 20 A (1 mm² as 18 AWG at 105 °C).
    const r = calc({ ...BASE, currentA: 33 });
    expect(r.recommendedFuseA).toBeNull();
    expect(r.recommendedFuseColour).toBeNull();
    expect(r.smallestWireForFuse).toBeNull();
    expect(r.currentWithinAmpacity).toBe(false);
    expect(r.notes.join('\n')).toMatch(/more than the largest standard blade fuse \(40 A\)/);
    // The next family that sells a rating: maxi blades, 50 A (from memory).
    expect(r.notes.join('\n')).toMatch(/a 50 A maxi blade fuse would do/);
  });

  it('notes a fuse that is not a blade rating or is below 125 % of the load', () => {
    const r = calc({ ...BASE, sizeMm2: 4, fuseA: 12 });
    expect(r.fuseColour).toBeNull();
    expect(r.notes.join('\n')).toMatch(/12 A is not a standard blade fuse rating/);
    expect(r.notes.join('\n')).toMatch(/less than 125 % of the load/);
  });

  it('answers the check values of the electrical issue', () => {
    const base = { currentA: 5, lengthM: 1, systemV: 12, returnPath: 'wire' } as const;
    // [C] Table 5, 2 AWG, 105 °C: 210 A × 0.85 (note 1) = 178.5 A.
    expect(
      calc({ ...base, awg: 2, insulationRatingC: 105, zone: 'engine_bay' }).ampacityA,
    ).toBeCloseTo(178.5, 6);
    // Table 5, 1/0 AWG, 105 °C, outside engine spaces: 285 A.
    expect(calc({ ...base, awg: '1/0', insulationRatingC: 105, zone: 'cabin' }).ampacityA).toBe(
      285,
    );
    // [C] 16 AWG, 80 °C, engine space: 20 × 0.78 = 15.6 A.
    expect(
      calc({ ...base, awg: 16, insulationRatingC: 80, zone: 'engine_bay' }).ampacityA,
    ).toBeCloseTo(15.6, 9);
  });

  it('takes the ambient of the zone, or one given, or a measured conductor temperature', () => {
    // [C] engine bay: 50 °C ambient; 12 A of 17 A (1 mm² as 18 AWG, 20 × 0.85):
    //     T = 50 + 55 × (12/17)² = 77.4 °C.
    const bay = calc({ ...BASE, zone: 'engine_bay' });
    expect(bay.ambientC).toBe(50);
    expect(bay.conductorTempC).toBeCloseTo(50 + 55 * (12 / 17) ** 2, 9);
    // [C] a given 20 °C ambient: 20 + 85 × (12/20)² = 50.6 °C.
    expect(calc({ ...BASE, ambientC: 20 }).conductorTempC).toBeCloseTo(50.6, 9);
    // A measured conductor temperature is used as given.
    const measured = calc({ ...BASE, conductorTempC: 20 });
    expect(measured.conductorTempEstimated).toBe(false);
    // [C] R = 0.017241 × 6 / 1 = 0.103446 Ω at 20 °C.
    expect(measured.resistanceOhm).toBeCloseTo(0.103446, 6);
  });

  it('recommends from the fuse family asked for', () => {
    // [C] 1.25 × 45 = 56.25 A → maxi 60 A (maxi ratings and colours from memory).
    const maxi = calc({ ...BASE, currentA: 45, sizeMm2: 16, fuseType: 'maxi_blade' });
    expect(maxi.recommendedFuseA).toBe(60);
    expect(maxi.recommendedFuseColour).toBe('blue');
    // [C] 1.25 × 120 = 150 A → a 150 A bolt-down strip fuse, no colour code.
    const strip = calc({ ...BASE, currentA: 120, sizeMm2: 35, fuseType: 'bolt_down' });
    expect(strip.recommendedFuseA).toBe(150);
    expect(strip.recommendedFuseColour).toBeNull();
  });

  it('counts the supply wire only on a chassis return', () => {
    const twoWire = calc(BASE);
    const chassis = calc({ ...BASE, returnPath: 'chassis' });
    expect(chassis.conductorLengthM).toBe(3);
    expect(chassis.voltageDropV).toBeCloseTo(twoWire.voltageDropV / 2, 9);
  });
});
