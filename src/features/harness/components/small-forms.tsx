import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import {
  CreateGroundPointRequest,
  CreateSpliceRequest,
  GROUND_LOCATIONS,
  GROUND_LOCATION_LABELS,
  type GroundPoint,
  type Splice,
} from '#shared/schemas/harness.schema.ts';
import { Button } from '@/components/ui/button.tsx';
import { SelectField, TextField } from '@/components/ui/field.tsx';
import { marksOf } from '@/lib/form-errors.ts';

/** An empty number field means "not recorded". */
const blankAsNull = (value: unknown) =>
  value == null || String(value).trim() === '' ? null : Number(String(value).replace(',', '.'));

interface SmallFormProps<T, Item> {
  /** The item being changed; a new one is added when absent. */
  initial?: Item;
  busy: boolean;
  error: Error | null;
  onSubmit: (values: T) => void;
  onCancel: () => void;
}

const FORM = 'grid gap-3 rounded-lg border border-rule bg-paper-raised p-4 sm:grid-cols-4';

function Actions({ busy, what, onCancel }: { busy: boolean; what: string; onCancel: () => void }) {
  return (
    <div className="flex items-end gap-2">
      <Button type="submit" variant="primary" busy={busy}>
        {what}
      </Button>
      <Button variant="quiet" onClick={onCancel}>
        Cancel
      </Button>
    </div>
  );
}

/** A new splice (its label is given the next "S-…" when left empty), or a change to one. */
export function SpliceForm({
  initial,
  busy,
  error,
  onSubmit,
  onCancel,
}: SmallFormProps<CreateSpliceRequest, Splice>) {
  const { register, handleSubmit, formState } = useForm({
    resolver: zodResolver(CreateSpliceRequest),
    defaultValues: initial
      ? {
          label: initial.label,
          sealed: initial.sealed,
          branch: initial.branch,
          distanceMm: initial.distanceMm,
          notes: initial.notes,
        }
      : { label: undefined, sealed: true, branch: '', distanceMm: null, notes: '' },
  });
  const title = initial ? `Change splice ${initial.label}` : 'Add a splice';
  const { errorOf, unplaced } = marksOf(formState.errors, error);
  const submit = handleSubmit(onSubmit);
  return (
    <form aria-label={title} onSubmit={(e) => void submit(e)} className={FORM}>
      <h2 className="font-semibold sm:col-span-4">{title}</h2>
      <TextField
        label="Label"
        placeholder="next S-…"
        {...register('label', { setValueAs: (v: string) => (v.trim() ? v : undefined) })}
        error={errorOf('label')}
      />
      <TextField label="Branch" {...register('branch')} error={errorOf('branch')} />
      <TextField
        label="From the datum (mm)"
        inputMode="decimal"
        {...register('distanceMm', { setValueAs: blankAsNull })}
        error={errorOf('distanceMm')}
      />
      <label className="flex items-center gap-2 self-end pb-2 text-sm">
        <input type="checkbox" {...register('sealed')} /> Sealed (heat-shrink with glue)
      </label>
      <TextField label="Notes" {...register('notes')} error={errorOf('notes')} />
      {unplaced ? (
        <p role="alert" className="text-sm text-fault sm:col-span-4">
          {unplaced}
        </p>
      ) : null}
      <Actions busy={busy} what={initial ? 'Save splice' : 'Add splice'} onCancel={onCancel} />
    </form>
  );
}

/**
 * A new ground point (where it is and the strap's size; the label defaults to the next "G-…"), or a
 * change to one.
 */
export function GroundPointForm({
  initial,
  busy,
  error,
  onSubmit,
  onCancel,
}: SmallFormProps<CreateGroundPointRequest, GroundPoint>) {
  const { register, handleSubmit, formState } = useForm({
    resolver: zodResolver(CreateGroundPointRequest),
    defaultValues: initial
      ? {
          label: initial.label,
          location: initial.location,
          strapSizeMm2: initial.strapSizeMm2,
          notes: initial.notes,
        }
      : { label: undefined, location: 'chassis' as const, strapSizeMm2: null, notes: '' },
  });
  const title = initial ? `Change ground point ${initial.label}` : 'Add a ground point';
  const { errorOf, unplaced } = marksOf(formState.errors, error);
  const submit = handleSubmit(onSubmit);
  return (
    <form aria-label={title} onSubmit={(e) => void submit(e)} className={FORM}>
      <h2 className="font-semibold sm:col-span-4">{title}</h2>
      <TextField
        label="Label"
        placeholder="next G-…"
        {...register('label', { setValueAs: (v: string) => (v.trim() ? v : undefined) })}
        error={errorOf('label')}
      />
      <SelectField label="Location" {...register('location')} error={errorOf('location')}>
        {GROUND_LOCATIONS.map((l) => (
          <option key={l} value={l}>
            {GROUND_LOCATION_LABELS[l]}
          </option>
        ))}
      </SelectField>
      <TextField
        label="Strap size (mm²)"
        inputMode="decimal"
        {...register('strapSizeMm2', { setValueAs: blankAsNull })}
        error={errorOf('strapSizeMm2')}
      />
      <TextField label="Notes" {...register('notes')} error={errorOf('notes')} />
      {unplaced ? (
        <p role="alert" className="text-sm text-fault sm:col-span-4">
          {unplaced}
        </p>
      ) : null}
      <Actions
        busy={busy}
        what={initial ? 'Save ground point' : 'Add ground point'}
        onCancel={onCancel}
      />
    </form>
  );
}
