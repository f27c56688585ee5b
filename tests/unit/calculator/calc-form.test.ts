import { describe, expect, it } from 'vitest';
import {
  calcFormToRequest,
  defaultCalcForm,
  serverErrorsToForm,
  type CalcFormValues,
} from '../../../src/features/calculator/lib/calc-form.ts';

const workshop = { sizeUnit: 'mm2' as const, systemVoltage: 12, defaultInsulationC: 105 };
const base = defaultCalcForm(workshop);

function read(values: Partial<CalcFormValues>) {
  return calcFormToRequest({ ...base, ...values });
}

describe('calculator form → request', () => {
  it('starts valid, in the workshop’s unit, voltage and insulation', () => {
    const r = read({});
    expect(r).toEqual({
      ok: true,
      input: {
        currentA: 10,
        lengthM: 3,
        systemV: 12,
        sizeMm2: 1.5,
        returnPath: 'wire',
        // No temperatures: the server takes the zone's ambient and estimates the conductor from
        // the load, as the checks do (one set of defaults for both).
        insulationRatingC: 105,
        zone: 'cabin',
        bundled: 1,
        fuseA: 15,
        fuseType: 'standard_blade',
        dropLimitPct: 3,
      },
    });
    expect(defaultCalcForm({ ...workshop, sizeUnit: 'awg' })).toMatchObject({
      unit: 'awg',
      size: '16',
    });
  });

  it('reads a size in either unit', () => {
    expect(read({ size: '1.5 mm²' })).toMatchObject({ ok: true, input: { sizeMm2: 1.5 } });
    const awg = read({ unit: 'awg', size: '4/0' });
    expect(awg).toMatchObject({ ok: true, input: { awg: '4/0' } });
    if (awg.ok) expect(awg.input).not.toHaveProperty('sizeMm2');
    expect(read({ unit: 'awg', size: '18 AWG' })).toMatchObject({ ok: true, input: { awg: '18' } });
  });

  it('puts the schema’s refusals beside the fields', () => {
    expect(read({ size: '1.1' })).toMatchObject({
      ok: false,
      errors: { size: expect.stringMatching(/ISO 6722/) },
    });
    expect(read({ unit: 'awg', size: '31' })).toMatchObject({
      ok: false,
      errors: { size: expect.stringMatching(/AWG/) },
    });
    expect(read({ currentA: '0' })).toMatchObject({
      ok: false,
      errors: { currentA: 'must be greater than 0' },
    });
    expect(read({ lengthM: '' })).toMatchObject({ ok: false, errors: { lengthM: 'is required' } });
    expect(read({ systemV: 'twelve' })).toMatchObject({
      ok: false,
      errors: { systemV: 'must be a number' },
    });
    expect(read({ bundled: '2.5' })).toMatchObject({
      ok: false,
      errors: { bundled: 'must be a whole number' },
    });
    expect(read({ size: '' })).toMatchObject({ ok: false, errors: { size: 'is required' } });
  });

  it('leaves out an empty fuse and drop limit', () => {
    const r = read({ fuseA: '', dropLimitPct: '' });
    expect(r.ok).toBe(true);
    if (r.ok) {
      expect(r.input).not.toHaveProperty('fuseA');
      expect(r.input).not.toHaveProperty('dropLimitPct');
    }
  });

  it('maps the server’s field names onto the form’s', () => {
    expect(
      serverErrorsToForm({ awg: 'must be an AWG size', currentA: 'too big', '(body)': 'x' }),
    ).toEqual({ size: 'must be an AWG size', currentA: 'too big' });
  });
});
