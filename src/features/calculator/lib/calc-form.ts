/**
 * The calculator page's inputs (text as typed) and their reading into a calculator request,
 * checked by the same zod schema as the server. Pure, so it is unit-tested in node.
 */
import { CalcRequest, type CalcRequestInput } from '#shared/schemas/calc.schema.ts';
import type { FuseType } from '#shared/schemas/feeds.schema.ts';
import type { SizeUnit } from '#shared/schemas/workshop.schema.ts';

export interface CalcFormValues {
  currentA: string;
  lengthM: string;
  systemV: string;
  unit: SizeUnit;
  /** In `unit`: "1.5" for mm², "16" or "4/0" for AWG. */
  size: string;
  returnPath: 'wire' | 'chassis';
  /** '' for the zone's Table 5 ambient. */
  ambientC: string;
  /** '' to estimate it from the load (FAA AC 43.13-1B ¶11-66), as the checks do. */
  conductorTempC: string;
  insulationRatingC: string;
  zone: 'cabin' | 'engine_bay';
  bundled: string;
  /** '' for no fuse. */
  fuseA: string;
  fuseType: FuseType;
  /** '' for no limit. */
  dropLimitPct: string;
}

/** The form's field for each request field, so errors land beside what was typed. */
const FIELD_OF: Record<string, keyof CalcFormValues> = {
  currentA: 'currentA',
  lengthM: 'lengthM',
  systemV: 'systemV',
  sizeMm2: 'size',
  awg: 'size',
  returnPath: 'returnPath',
  ambientC: 'ambientC',
  conductorTempC: 'conductorTempC',
  fuseType: 'fuseType',
  insulationRatingC: 'insulationRatingC',
  zone: 'zone',
  bundled: 'bundled',
  fuseA: 'fuseA',
  dropLimitPct: 'dropLimitPct',
};

export type CalcFormErrors = Partial<Record<keyof CalcFormValues, string>>;

export function defaultCalcForm(workshop: {
  sizeUnit: SizeUnit;
  systemVoltage: number;
  defaultInsulationC: number;
}): CalcFormValues {
  return {
    currentA: '10',
    lengthM: '3',
    systemV: String(workshop.systemVoltage),
    unit: workshop.sizeUnit,
    size: workshop.sizeUnit === 'awg' ? '16' : '1.5',
    returnPath: 'wire',
    ambientC: '',
    conductorTempC: '',
    insulationRatingC: String(workshop.defaultInsulationC),
    zone: 'cabin',
    bundled: '1',
    fuseA: '15',
    fuseType: 'standard_blade',
    dropLimitPct: '3',
  };
}

/** "" is undefined (not given), anything else a number or NaN; a decimal comma is accepted. */
const toNumber = (text: string): number | undefined => {
  const t = text.trim().replace(',', '.');
  if (t === '') return undefined;
  return Number(t);
};

export type CalcFormRead =
  { ok: true; input: CalcRequestInput } | { ok: false; errors: CalcFormErrors };

/** Reads the form into a request; errors keyed by the form's fields. */
export function calcFormToRequest(values: CalcFormValues): CalcFormRead {
  const errors: CalcFormErrors = {};
  const number = (field: keyof CalcFormValues, required: boolean, text = values[field]) => {
    const n = toNumber(text);
    if (n === undefined) {
      if (required) errors[field] = 'is required';
      return undefined;
    }
    if (Number.isNaN(n)) {
      errors[field] = 'must be a number';
      return undefined;
    }
    return n;
  };

  const size = values.size.trim();
  if (size === '') errors.size = 'is required';
  const sizeField =
    size === ''
      ? {}
      : values.unit === 'awg'
        ? { awg: size.replace(/\s*awg$/i, '') }
        : { sizeMm2: number('size', true, size.replace(/\s*mm(²|2|\^2)?$/i, '')) };

  const input = {
    currentA: number('currentA', true),
    lengthM: number('lengthM', true),
    systemV: number('systemV', true),
    ...sizeField,
    returnPath: values.returnPath,
    ambientC: number('ambientC', false),
    conductorTempC: number('conductorTempC', false),
    insulationRatingC: number('insulationRatingC', false),
    zone: values.zone,
    bundled: number('bundled', false),
    fuseA: number('fuseA', false),
    fuseType: values.fuseType,
    dropLimitPct: number('dropLimitPct', false),
  };
  // Leave out what was not given so the schema's defaults apply.
  const request = Object.fromEntries(
    Object.entries(input).filter(([, v]) => v !== undefined),
  ) as CalcRequestInput;

  const parsed = CalcRequest.safeParse(request);
  if (!parsed.success) {
    for (const issue of parsed.error.issues) {
      const field = FIELD_OF[String(issue.path[0] ?? '')] ?? 'size';
      errors[field] ??= issue.message;
    }
  }
  if (Object.keys(errors).length) return { ok: false, errors };
  return { ok: true, input: request };
}

/** The server's 400 details ({field, message}) as errors beside the form's fields. */
export function serverErrorsToForm(issues: Record<string, string>): CalcFormErrors {
  const errors: CalcFormErrors = {};
  for (const [field, message] of Object.entries(issues)) {
    const formField = FIELD_OF[field];
    if (formField) errors[formField] ??= message;
  }
  return errors;
}
