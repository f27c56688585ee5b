import { describe, expect, it } from 'vitest';
import { CalcRequest } from '#shared/schemas/calc.schema.ts';

const VALID = { currentA: 12, lengthM: 3, systemV: 12, returnPath: 'wire', sizeMm2: 1.5 };

/** The fields named by the issues of a refused request. */
function refusedFields(input: unknown): string[] {
  const parsed = CalcRequest.safeParse(input);
  expect(parsed.success).toBe(false);
  return parsed.success ? [] : parsed.error.issues.map((i) => i.path.join('.') || '(body)');
}

describe('calculator request', () => {
  it('accepts a minimal request and fills the defaults', () => {
    expect(CalcRequest.parse(VALID)).toEqual({
      ...VALID,
      awgAreaBasis: 'sae-j1128-min',
      fuseType: 'standard_blade',
      insulationRatingC: 105,
      zone: 'cabin',
      bundled: 1,
    });
  });

  it('accepts an AWG size as a gauge number or as written', () => {
    const { sizeMm2: _omit, ...rest } = VALID;
    expect(CalcRequest.parse({ ...rest, awg: 16 }).awg).toBe(16);
    expect(CalcRequest.parse({ ...rest, awg: '4/0' }).awg).toBe(-3);
    expect(CalcRequest.parse({ ...rest, awg: '18 AWG' }).awg).toBe(18);
    expect(CalcRequest.parse({ ...rest, awg: 30 }).awg).toBe(30);
  });

  it('accepts the optional fuse and drop limit, 24 V and 48 V', () => {
    const parsed = CalcRequest.parse({ ...VALID, systemV: 48, fuseA: 7.5, dropLimitPct: 3 });
    expect(parsed).toMatchObject({ systemV: 48, fuseA: 7.5, dropLimitPct: 3 });
    expect(CalcRequest.parse({ ...VALID, systemV: 24 }).systemV).toBe(24);
  });

  it('refuses a zero or negative current or length', () => {
    expect(refusedFields({ ...VALID, currentA: 0 })).toEqual(['currentA']);
    expect(refusedFields({ ...VALID, currentA: -2 })).toEqual(['currentA']);
    expect(refusedFields({ ...VALID, lengthM: 0 })).toEqual(['lengthM']);
    expect(refusedFields({ ...VALID, lengthM: -1 })).toEqual(['lengthM']);
    expect(refusedFields({ ...VALID, currentA: '12' })).toEqual(['currentA']);
  });

  it('refuses an AWG outside 4/0…30', () => {
    const { sizeMm2: _omit, ...rest } = VALID;
    for (const awg of [31, -4, 2.5, '5/0', 'eighteen', '']) {
      expect(refusedFields({ ...rest, awg })).toEqual(['awg']);
    }
  });

  it('refuses a metric size outside the ISO 6722 series', () => {
    expect(refusedFields({ ...VALID, sizeMm2: 0.8 })).toEqual(['sizeMm2']);
    expect(refusedFields({ ...VALID, sizeMm2: 0 })).toEqual(['sizeMm2']);
    const parsed = CalcRequest.safeParse({ ...VALID, sizeMm2: 0.8 });
    expect(parsed.error?.issues[0]?.message).toMatch(/ISO 6722/);
  });

  it('wants exactly one of sizeMm2 and awg, and names both', () => {
    const both = CalcRequest.safeParse({ ...VALID, awg: 16 });
    expect(both.success).toBe(false);
    expect(both.error?.issues.map((i) => i.path.join('.'))).toEqual(['awg']);
    expect(both.error?.issues[0]?.message).toMatch(/sizeMm2 or awg, not both/);
    const { sizeMm2: _omit, ...neither } = VALID;
    const none = CalcRequest.safeParse(neither);
    expect(none.success).toBe(false);
    expect(none.error?.issues[0]?.message).toMatch(/sizeMm2 or awg/);
  });

  it('refuses unknown enum values', () => {
    expect(refusedFields({ ...VALID, returnPath: 'ground' })).toEqual(['returnPath']);
    expect(refusedFields({ ...VALID, zone: 'boot' })).toEqual(['zone']);
  });

  it('refuses unknown keys', () => {
    expect(refusedFields({ ...VALID, colour: 'RD' })).toEqual(['(body)']);
    const parsed = CalcRequest.safeParse({ ...VALID, colour: 'RD' });
    expect(parsed.error?.issues[0]?.code).toBe('unrecognized_keys');
  });

  it('refuses voltages, limits, fuses, bundles and ratings out of range', () => {
    expect(refusedFields({ ...VALID, systemV: 0 })).toEqual(['systemV']);
    expect(refusedFields({ ...VALID, systemV: 61 })).toEqual(['systemV']);
    expect(refusedFields({ ...VALID, dropLimitPct: 0 })).toEqual(['dropLimitPct']);
    expect(refusedFields({ ...VALID, dropLimitPct: 51 })).toEqual(['dropLimitPct']);
    expect(refusedFields({ ...VALID, fuseA: 0 })).toEqual(['fuseA']);
    expect(refusedFields({ ...VALID, bundled: 0 })).toEqual(['bundled']);
    expect(refusedFields({ ...VALID, bundled: 1.5 })).toEqual(['bundled']);
    expect(refusedFields({ ...VALID, insulationRatingC: 100 })).toEqual(['insulationRatingC']);
    expect(refusedFields({ ...VALID, conductorTempC: 300 })).toEqual(['conductorTempC']);
  });
});
