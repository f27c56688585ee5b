import { useId } from 'react';
import { useFormContext } from 'react-hook-form';
import {
  exactAwg,
  formatAwgGauge,
  ISO_6722_SIZES_MM2,
  parseWireSize,
  SOLD_AWG_GAUGES,
} from '#shared/domain/wire-sizes.ts';
import { parseWireColour } from '#shared/domain/wire-colours.ts';
import {
  RETURN_PATH_LABELS,
  RETURN_PATHS,
  WIRE_ZONE_LABELS,
  WIRE_ZONES,
} from '#shared/schemas/feeds.schema.ts';
import {
  INSULATION_RATINGS_C,
  SIZE_UNIT_LABELS,
  type SizeUnit,
} from '#shared/schemas/workshop.schema.ts';
import { SelectField, TextField } from '@/components/ui/field.tsx';
import { WireColour } from '@/components/ui/wire-colour.tsx';
import { useErrorOf } from '@/lib/form-errors.ts';
import { num } from '../lib/feed-display.ts';
import type { FeedFormValues } from '../lib/feed-form.ts';
import { FormGroup } from './form-group.tsx';

function sizeHint(text: string, unit: SizeUnit): string {
  const size = parseWireSize(text, unit);
  if (unit === 'awg' && size.ok && size.areaMm2 !== null && exactAwg(size.areaMm2) !== null) {
    return `= ${num(size.areaMm2, 3)} mm² of copper`;
  }
  return unit === 'mm2' ? 'ISO 6722, e.g. 1.5; or “16 AWG”' : 'A gauge, e.g. 16; or “1.5 mm²”';
}

/** The feed's wire: size, insulation, run length, zone, return, bundle and colour. */
export function WireFields({ values, sizeUnit }: { values: FeedFormValues; sizeUnit: SizeUnit }) {
  const { register } = useFormContext<FeedFormValues>();
  const errorOf = useErrorOf();
  const sizeListId = useId();
  const colourPreview = values.colour.trim() ? parseWireColour(values.colour) : null;

  return (
    <FormGroup legend="Wire" columns="sm:grid-cols-2 lg:grid-cols-3">
      <TextField
        label={`Size (${SIZE_UNIT_LABELS[sizeUnit]})`}
        list={sizeListId}
        autoComplete="off"
        className="font-mono"
        {...register('wireSize')}
        error={errorOf('wire.sizeMm2')}
        hint={sizeHint(values.wireSize, sizeUnit)}
      />
      <datalist id={sizeListId}>
        {sizeUnit === 'mm2'
          ? ISO_6722_SIZES_MM2.map((s) => <option key={s} value={String(s)} />)
          : SOLD_AWG_GAUGES.map((g) => <option key={g} value={formatAwgGauge(g)} />)}
      </datalist>
      <SelectField
        label="Insulation rating"
        {...register('insulationRatingC')}
        error={errorOf('wire.insulationRatingC')}
      >
        {INSULATION_RATINGS_C.map((c) => (
          <option key={c} value={String(c)}>
            {c} °C
          </option>
        ))}
      </SelectField>
      <TextField
        label="One-way length (m)"
        inputMode="decimal"
        className="font-mono"
        {...register('lengthM')}
        error={errorOf('wire.lengthM')}
        hint="From the fuse to the load."
      />
      <SelectField label="Zone" {...register('zone')} error={errorOf('wire.zone')}>
        {WIRE_ZONES.map((z) => (
          <option key={z} value={z}>
            {WIRE_ZONE_LABELS[z]}
          </option>
        ))}
      </SelectField>
      <SelectField label="Return" {...register('returnPath')} error={errorOf('wire.returnPath')}>
        {RETURN_PATHS.map((r) => (
          <option key={r} value={r}>
            {RETURN_PATH_LABELS[r]}
          </option>
        ))}
      </SelectField>
      <TextField
        label="Conductors in the bundle"
        inputMode="numeric"
        className="font-mono"
        {...register('bundled')}
        error={errorOf('wire.bundled')}
        hint="This one included."
      />
      <TextField
        label="Terminals and splices"
        inputMode="numeric"
        className="font-mono"
        {...register('connections')}
        error={errorOf('wire.connections')}
        hint="Crimped joints from source to load, for the drop budget."
      />
      <TextField
        label="Colour (IEC 60757)"
        autoComplete="off"
        className="font-mono uppercase"
        {...register('colour')}
        error={errorOf('wire.colour')}
        hint={
          colourPreview?.ok ? (
            <>
              <WireColour value={colourPreview.value} />
              {colourPreview.note ? <span className="block">{colourPreview.note}</span> : null}
            </>
          ) : (
            'Base and stripe, e.g. BU/WH (BLU/WHT reads the same); GNYE only for green-yellow'
          )
        }
      />
    </FormGroup>
  );
}
