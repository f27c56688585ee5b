import { useId, useState } from 'react';
import { AMBIENT_C } from '#shared/domain/electrical/conductor-temperature.ts';
import { FUSE_FAMILIES, FUSE_TYPES } from '#shared/domain/electrical/fuses.ts';
import {
  AWG_GAUGES,
  editableWireSize,
  formatAwgGauge,
  ISO_6722_SIZES_MM2,
  parseWireSize,
} from '#shared/domain/wire-sizes.ts';
import { RETURN_PATH_LABELS, WIRE_ZONE_LABELS } from '#shared/schemas/feeds.schema.ts';
import {
  INSULATION_RATINGS_C,
  SIZE_UNIT_LABELS,
  type SizeUnit,
} from '#shared/schemas/workshop.schema.ts';
import { SelectField, TextField } from '@/components/ui/field.tsx';
import { Notice } from '@/components/ui/notice.tsx';
import { ApiError } from '@/lib/api-client.ts';
import { useCalcRun } from '../api/run-calc.ts';
import {
  calcFormToRequest,
  defaultCalcForm,
  serverErrorsToForm,
  type CalcFormValues,
} from '../lib/calc-form.ts';
import { CalcResultView } from './calc-result.tsx';

/** Two or more choices as a row of toggle buttons (a radio group underneath). */
function UnitToggle({ value, onChange }: { value: SizeUnit; onChange: (unit: SizeUnit) => void }) {
  return (
    <fieldset className="flex flex-col gap-1">
      <legend className="mb-1 text-sm font-medium text-ink-soft">Size unit</legend>
      <div className="inline-flex w-fit rounded-md border border-rule-strong bg-paper-raised p-0.5">
        {(['mm2', 'awg'] as const).map((unit) => (
          <label
            key={unit}
            className={`relative cursor-pointer rounded px-3 py-2 text-sm font-medium has-[:focus-visible]:outline-3 has-[:focus-visible]:outline-focus ${
              value === unit ? 'bg-ink text-paper' : 'text-ink-soft hover:bg-paper-sunk'
            }`}
          >
            <input
              type="radio"
              name="size-unit"
              value={unit}
              checked={value === unit}
              onChange={() => onChange(unit)}
              // Invisible but covering the label, so the whole button is the radio.
              className="absolute inset-0 cursor-pointer opacity-0"
            />
            {SIZE_UNIT_LABELS[unit]}
          </label>
        ))}
      </div>
    </fieldset>
  );
}

/** What-ifs for one circuit: any inputs, the full answer with its working and sources. */
export function CalculatorScreen({
  workshop,
}: {
  workshop: { sizeUnit: SizeUnit; systemVoltage: number; defaultInsulationC: number };
}) {
  const [values, setValues] = useState<CalcFormValues>(() => defaultCalcForm(workshop));
  const read = calcFormToRequest(values);
  const calc = useCalcRun(read.ok ? read.input : null);
  const listId = useId();
  const fuseListId = useId();

  const serverErrors =
    calc.error instanceof ApiError && calc.error.status === 400
      ? serverErrorsToForm(calc.error.fieldIssues())
      : {};
  const errors = read.ok ? serverErrors : read.errors;
  const set = <K extends keyof CalcFormValues>(key: K, value: CalcFormValues[K]) =>
    setValues((v) => ({ ...v, [key]: value }));

  function switchUnit(unit: SizeUnit) {
    // Carry the size across to the nearest size of the other series.
    const parsed = parseWireSize(values.size, values.unit);
    const size =
      parsed.ok && parsed.areaMm2 !== null ? editableWireSize(parsed.areaMm2, unit) : values.size;
    setValues((v) => ({ ...v, unit, size }));
  }

  const text = (key: keyof CalcFormValues, label: string, hint?: string, unit?: string) => (
    <TextField
      label={unit ? `${label} (${unit})` : label}
      name={key}
      inputMode="decimal"
      autoComplete="off"
      value={values[key]}
      onChange={(e) => set(key, e.target.value)}
      error={errors[key]}
      hint={hint}
      className="font-mono"
    />
  );

  const marked = !read.ok || Object.keys(serverErrors).length > 0;
  const otherError = calc.isError && !marked ? calc.error.message : null;

  return (
    <div className="grid items-start gap-6 lg:grid-cols-[minmax(0,30rem)_minmax(0,1fr)]">
      <form
        noValidate
        aria-label="Circuit"
        onSubmit={(e) => e.preventDefault()}
        className="grid gap-4 rounded-lg border border-rule bg-paper-raised p-5 sm:grid-cols-2"
      >
        <h2 className="text-lg font-semibold sm:col-span-2">The circuit</h2>
        {text('currentA', 'Current', 'The load, taken as continuous.', 'A')}
        {text('lengthM', 'One-way length', 'From the fuse to the load.', 'm')}
        <UnitToggle value={values.unit} onChange={switchUnit} />
        <TextField
          label={`Wire size (${SIZE_UNIT_LABELS[values.unit]})`}
          name="size"
          autoComplete="off"
          list={listId}
          value={values.size}
          onChange={(e) => set('size', e.target.value)}
          error={errors.size}
          hint={values.unit === 'mm2' ? 'An ISO 6722 size, e.g. 1.5' : 'A gauge, e.g. 16 or 4/0'}
          className="font-mono"
        />
        <datalist id={listId}>
          {values.unit === 'mm2'
            ? ISO_6722_SIZES_MM2.map((s) => <option key={s} value={String(s)} />)
            : AWG_GAUGES.map((g) => <option key={g} value={formatAwgGauge(g)} />)}
        </datalist>
        <div className="sm:col-span-2">
          <SelectField
            label="Return path"
            name="returnPath"
            value={values.returnPath}
            onChange={(e) => set('returnPath', e.target.value as CalcFormValues['returnPath'])}
            error={errors.returnPath}
          >
            <option value="wire">{RETURN_PATH_LABELS.wire}</option>
            <option value="chassis">{RETURN_PATH_LABELS.chassis}</option>
          </SelectField>
        </div>
        <div className="sm:col-span-2">
          <SelectField
            label="Zone"
            name="zone"
            value={values.zone}
            onChange={(e) => set('zone', e.target.value as CalcFormValues['zone'])}
            error={errors.zone}
          >
            <option value="cabin">{WIRE_ZONE_LABELS.cabin}</option>
            <option value="engine_bay">{WIRE_ZONE_LABELS.engine_bay}</option>
          </SelectField>
        </div>
        <SelectField
          label="Insulation rating"
          name="insulationRatingC"
          value={values.insulationRatingC}
          onChange={(e) => set('insulationRatingC', e.target.value)}
          error={errors.insulationRatingC}
        >
          {INSULATION_RATINGS_C.map((c) => (
            <option key={c} value={String(c)}>
              {c} °C
            </option>
          ))}
        </SelectField>
        {text(
          'bundled',
          'Conductors in the bundle',
          '3 or more applies the bundle factors (a conservative choice below 50 V).',
        )}
        {text(
          'ambientC',
          'Air around the wire',
          `Empty: ${AMBIENT_C.cabin} °C outside the engine bay, ${AMBIENT_C.engine_bay} °C in it, as Table 5 assumes and the checks take.`,
          '°C',
        )}
        {text(
          'conductorTempC',
          'Conductor temperature',
          'Empty: estimated from the load (FAA AC 43.13-1B ¶11-66), as the checks do. Fill in only a measured value.',
          '°C',
        )}
        <SelectField
          label="Fuse type"
          name="fuseType"
          value={values.fuseType}
          onChange={(e) => set('fuseType', e.target.value as CalcFormValues['fuseType'])}
          error={errors.fuseType}
          hint={FUSE_FAMILIES[values.fuseType].description}
        >
          {FUSE_TYPES.map((t) => (
            <option key={t} value={t}>
              {FUSE_FAMILIES[t].label}
            </option>
          ))}
        </SelectField>
        {text('systemV', 'System voltage', undefined, 'V')}
        <TextField
          label="Fuse (A)"
          name="fuseA"
          inputMode="decimal"
          autoComplete="off"
          list={fuseListId}
          value={values.fuseA}
          onChange={(e) => set('fuseA', e.target.value)}
          error={errors.fuseA}
          hint="Empty for none."
          className="font-mono"
        />
        <datalist id={fuseListId}>
          {FUSE_FAMILIES[values.fuseType].ratings.map((f) => (
            <option
              key={f.ratingA}
              value={String(f.ratingA)}
              label={f.colour ? `${f.ratingA} A (${f.colour})` : `${f.ratingA} A`}
            />
          ))}
        </datalist>
        {text(
          'dropLimitPct',
          'Drop limit',
          'ABYC E-11: 3 % critical, 10 % general. Empty for none.',
          '%',
        )}
      </form>

      <section
        aria-labelledby="calc-result-heading"
        className="rounded-lg border border-rule bg-paper-raised p-5"
      >
        <div className="mb-2 flex items-baseline justify-between gap-3">
          <h2 id="calc-result-heading" className="text-lg font-semibold">
            Result
          </h2>
          <p role="status" className="text-xs text-ink-faint">
            {calc.stale && read.ok ? 'Updating…' : ''}
          </p>
        </div>
        {marked ? (
          <p className="text-ink-soft">Correct the marked inputs to see the result.</p>
        ) : otherError ? (
          <Notice tone="fault" title="The calculator could not answer">
            {otherError}
          </Notice>
        ) : calc.data ? (
          <div className={calc.stale ? 'opacity-60 transition-opacity' : 'transition-opacity'}>
            <CalcResultView result={calc.data.result} request={calc.data.input} mode="full" />
          </div>
        ) : (
          <p role="status" className="text-ink-soft">
            Calculating…
          </p>
        )}
      </section>
    </div>
  );
}
