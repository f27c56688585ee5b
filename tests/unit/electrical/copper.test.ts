import { describe, expect, it } from 'vitest';
import {
  conductorResistance,
  conductorResistanceOhm,
  COPPER_ALPHA_20_PER_C,
  COPPER_RESISTIVITY_OHM_MM2_PER_M,
  copperTemperatureFactor,
  ISO_6722_MAX_RESISTANCE_MOHM_PER_M,
  iso6722MaxResistanceOhmPerM,
  resistanceAreaMm2,
  SAE_J1128_MIN_AREA_CMIL,
} from '#shared/domain/electrical/copper.ts';
import { awgAreaMm2, storedAwgAreaMm2 } from '#shared/domain/wire-sizes.ts';

const FOOT_M = 0.3048;
const relative = (a: number, b: number) => Math.abs(a - b) / b;

describe('copper resistance at 20 °C', () => {
  it('uses the annealed-copper resistivity', () => {
    // IEC 60028 / IEC 60287-1-1 Table 1: 0.017241 Ω·mm²/m → 1 m of 1 mm² is 0.017241 Ω.
    expect(COPPER_RESISTIVITY_OHM_MM2_PER_M).toBe(0.017241);
    expect(conductorResistanceOhm({ areaMm2: 1, lengthM: 1 })).toBeCloseTo(0.017241, 9);
    // [C] R = ρ·L/A = 0.017241 × 10 / 2.5 = 0.068964 Ω.
    expect(conductorResistanceOhm({ areaMm2: 2.5, lengthM: 10 })).toBeCloseTo(0.068964, 9);
  });

  // HyperPhysics "Common wire gauges" (after Floyd): solid copper, Ω per 1000 ft at 20 °C.
  it.each([
    [10, 0.9989],
    [12, 1.588],
    [14, 2.525],
    [16, 4.016],
    [18, 6.385],
    [20, 10.15],
  ])('%i AWG from its ASTM B258 area is %f Ω/1000 ft within 0.5 %', (gauge, published) => {
    const ohm = conductorResistanceOhm({
      areaMm2: awgAreaMm2(gauge),
      lengthM: 1000 * FOOT_M,
      awgAreaBasis: 'astm-b258-nominal',
    });
    expect(relative(ohm, published)).toBeLessThan(0.005);
  });

  it('takes a given resistivity, as worked examples use', () => {
    // [C] ρ = 0.01785 (the worked example's value): 0.01785 × 40 / 1.3 = 0.54923 Ω.
    const r = conductorResistance({
      areaMm2: 1.3,
      lengthM: 40,
      resistivityOhmMm2PerM: 0.01785,
      awgAreaBasis: 'astm-b258-nominal',
    });
    expect(r.resistanceOhm).toBeCloseTo(0.54923, 5);
    expect(r.sources).not.toContain('iacs-copper');
    expect(r.notes.join(' ')).toMatch(/as given/);
  });
});

describe('automotive AWG cable at its SAE J1128 minimum area', () => {
  // SAE J1128 minimum areas, circular mils, as reprinted in a wire maker's catalogue appendix.
  it.each([
    [18, 1537],
    [16, 2336],
    [14, 3702],
    [12, 5833],
    [10, 9343],
    [8, 14810],
    [6, 24538],
    [4, 37360],
  ])('%i AWG is worked at %i cmil by default', (gauge, cmil) => {
    expect(SAE_J1128_MIN_AREA_CMIL[gauge]).toBe(cmil);
    const worked = resistanceAreaMm2(storedAwgAreaMm2(gauge));
    expect(worked.basisUsed).toBe('sae-j1128-min');
    // [C] 1 cmil = 5.067×10⁻⁴ mm².
    expect(worked.areaMm2).toBeCloseTo(cmil * 5.067e-4, 9);
    // 5–11 % below the ASTM B258 nominal area (the same appendix says so).
    const below = 1 - worked.areaMm2 / awgAreaMm2(gauge);
    expect(below).toBeGreaterThan(0.04);
    expect(below).toBeLessThan(0.12);
  });

  it('keeps the ASTM B258 nominal area when asked, and for gauges no minimum is held for', () => {
    expect(resistanceAreaMm2(storedAwgAreaMm2(12), 'astm-b258-nominal').basisUsed).toBe(
      'astm-b258-nominal',
    );
    const thick = resistanceAreaMm2(storedAwgAreaMm2(2));
    expect(thick.basisUsed).toBe('astm-b258-nominal');
    expect(thick.note).toMatch(/No SAE J1128 minimum area is held for 2 AWG/);
    // A metric size is worked at its own area.
    expect(resistanceAreaMm2(2.5)).toEqual({ areaMm2: 2.5, basisUsed: 'as-given', note: null });
  });

  it('names the J1128 area in the working', () => {
    const r = conductorResistance({ areaMm2: storedAwgAreaMm2(14), lengthM: 1 });
    expect(r.sources).toContain('sae-j1128-area');
    expect(r.notes.join(' ')).toMatch(/3702 cmil/);
    // [C] 0.017241 / (3702 × 5.067e-4) = 0.0091912 Ω/m
    expect(r.ohmPerM20).toBeCloseTo(0.017241 / (3702 * 5.067e-4), 9);
  });
});

describe('the ISO 6722 maximum-resistance option', () => {
  // ISO 6722-1 maximum conductor resistance at 20 °C, mΩ/m, from cable makers' datasheets.
  it.each([
    [0.35, 54.4],
    [0.5, 37.1],
    [0.75, 24.7],
    [1, 18.5],
    [1.5, 12.7],
    [2, 9.42],
    [2.5, 7.6],
    [3, 6.15],
    [4, 4.71],
    [6, 3.14],
    [10, 1.82],
    [16, 1.16],
  ])('%f mm² is at most %f mΩ/m', (areaMm2, mOhmPerM) => {
    expect(iso6722MaxResistanceOhmPerM(areaMm2)).toBeCloseTo(mOhmPerM / 1000, 9);
    const r = conductorResistance({ areaMm2, lengthM: 1, model: 'iso6722-max' });
    expect(r.modelUsed).toBe('iso6722-max');
    expect(r.resistanceOhm).toBeCloseTo(mOhmPerM / 1000, 9);
    expect(r.sources).toContain('iso-6722');
  });

  it('is above the nominal value of a solid conductor of the same area in every size', () => {
    // [C] A maximum for a stranded conductor must exceed ρ/A; a typo in the table would show here.
    for (const [size, mOhm] of Object.entries(ISO_6722_MAX_RESISTANCE_MOHM_PER_M)) {
      const nominal = (COPPER_RESISTIVITY_OHM_MM2_PER_M / Number(size)) * 1000;
      expect(mOhm).toBeGreaterThan(nominal);
      expect(mOhm).toBeLessThan(nominal * 1.15);
    }
  });

  it('corrects the table value for temperature too', () => {
    // [C] 2.5 mm², 10 m, 105 °C: 7.60 mΩ/m × 10 m × (1 + 0.00393 × 85) = 0.101388 Ω.
    const r = conductorResistance({
      areaMm2: 2.5,
      lengthM: 10,
      conductorTempC: 105,
      model: 'iso6722-max',
    });
    expect(r.resistanceOhm).toBeCloseTo(0.101388, 5);
  });

  it('falls back to IACS for sizes the table lacks, and says so', () => {
    // 25 mm² is an ISO 6722 size without a maximum in the table held; 0.823 mm² is 18 AWG.
    for (const areaMm2 of [25, 0.22, awgAreaMm2(18)]) {
      const r = conductorResistance({
        areaMm2,
        lengthM: 1,
        model: 'iso6722-max',
        awgAreaBasis: 'astm-b258-nominal',
      });
      expect(r.modelUsed).toBe('iacs');
      expect(r.resistanceOhm).toBeCloseTo(COPPER_RESISTIVITY_OHM_MM2_PER_M / areaMm2, 9);
      expect(r.notes.join(' ')).toMatch(/not in the ISO 6722 maximum-resistance table/);
      expect(r.sources).toContain('iacs-copper');
    }
  });
});

describe('temperature correction', () => {
  it('uses α₂₀ = 0.00393 /°C (IACS)', () => {
    expect(COPPER_ALPHA_20_PER_C).toBe(0.00393);
    expect(copperTemperatureFactor(20)).toBe(1);
    // [C] 1 + 0.00393 × (105 − 20) = 1.33405
    expect(copperTemperatureFactor(105)).toBeCloseTo(1.33405, 6);
    // [C] 1 + 0.00393 × (−40 − 20) = 0.7642
    expect(copperTemperatureFactor(-40)).toBeCloseTo(0.7642, 6);
    // [C] 1 mm², 1 m at 85 °C: 0.017241 × 1.25545 = 0.0216452 Ω
    expect(conductorResistanceOhm({ areaMm2: 1, lengthM: 1, conductorTempC: 85 })).toBeCloseTo(
      0.0216452,
      7,
    );
  });

  // FAA AC 43.13-1B §11-66: R_T = R₂₀ · (234.5 + T) / 254.5, the same law in another form.
  it.each([-40, 0, 20, 50, 85, 105, 125, 150])(
    'agrees with the FAA form within 0.1 %% at %i °C',
    (t) => {
      const faa = (234.5 + t) / 254.5;
      expect(relative(copperTemperatureFactor(t), faa)).toBeLessThan(0.001);
    },
  );

  it('names the correction in its working', () => {
    const r = conductorResistance({ areaMm2: 1, lengthM: 1, conductorTempC: 60 });
    expect(r.temperatureFactor).toBeCloseTo(1.1572, 6); // [C] 1 + 0.00393 × 40
    expect(r.notes.join(' ')).toMatch(/20 °C to 60 °C/);
  });
});

describe('refusals', () => {
  it('refuses sizes, lengths and temperatures that are not physical', () => {
    expect(() => conductorResistanceOhm({ areaMm2: 0, lengthM: 1 })).toThrow(RangeError);
    expect(() => conductorResistanceOhm({ areaMm2: 1, lengthM: -1 })).toThrow(RangeError);
    expect(() => conductorResistanceOhm({ areaMm2: Number.NaN, lengthM: 1 })).toThrow(RangeError);
    expect(() => conductorResistanceOhm({ areaMm2: 1, lengthM: 1, conductorTempC: -300 })).toThrow(
      RangeError,
    );
  });
});
