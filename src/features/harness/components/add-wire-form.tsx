import { useState, type FormEvent } from 'react';
import type { CreateWireRequest, WireEnd } from '#shared/schemas/harness.schema.ts';
import { Button } from '@/components/ui/button.tsx';
import { TextField } from '@/components/ui/field.tsx';
import { endText, type EndOption } from '../lib/end-options.ts';
import { EndPicker } from './end-picker.tsx';

interface AddWireFormProps {
  options: readonly EndOption[];
  byKey: ReadonlyMap<string, EndOption>;
  busy: boolean;
  error: string | null;
  /** Put the cursor in end A (the form was just emptied for the next wire). */
  focusFirst: boolean;
  onAdd: (input: CreateWireRequest) => void;
  onClose: () => void;
}

/** One end of the new wire: the type-ahead until something is picked, then what was picked. */
function EndField({
  name,
  value,
  options,
  byKey,
  onChange,
  autoFocus = false,
}: {
  autoFocus?: boolean;
  name: string;
  value: WireEnd | null;
  options: readonly EndOption[];
  byKey: ReadonlyMap<string, EndOption>;
  onChange: (end: WireEnd | null) => void;
}) {
  return (
    <div className="flex min-w-72 flex-col gap-1">
      <span className="text-sm font-medium text-ink-soft">{name}</span>
      {value ? (
        <span className="flex items-center gap-2 rounded-md border border-rule-strong bg-paper px-3 py-1.5 text-sm">
          <span className="flex-1">{endText(value, byKey)}</span>
          <button
            type="button"
            aria-label={`Change ${name}`}
            onClick={() => onChange(null)}
            className="text-copper-deep hover:underline"
          >
            Change
          </button>
        </span>
      ) : (
        <EndPicker
          options={options}
          label={name}
          autoFocus={autoFocus}
          onPick={(end) => onChange(end)}
          onCancel={() => undefined}
        />
      )}
    </div>
  );
}

/** A new wire: both ends picked from the conversion's places; label, colour and size optional. */
export function AddWireForm({
  options,
  byKey,
  busy,
  error,
  focusFirst,
  onAdd,
  onClose,
}: AddWireFormProps) {
  const [a, setA] = useState<WireEnd | null>(null);
  const [b, setB] = useState<WireEnd | null>(null);
  const [label, setLabel] = useState('');
  const [colour, setColour] = useState('');
  const [size, setSize] = useState('');
  const [missing, setMissing] = useState(false);

  const submit = (e: FormEvent) => {
    e.preventDefault();
    if (!a || !b) {
      setMissing(true);
      return;
    }
    const sizeMm2 = size.trim() ? Number(size.replace(',', '.')) : undefined;
    onAdd({
      ends: [a, b],
      ...(label.trim() ? { label: label.trim() } : {}),
      ...(colour.trim() ? { colour: colour.trim() } : {}),
      ...(sizeMm2 !== undefined && Number.isFinite(sizeMm2) ? { sizeMm2 } : {}),
    });
  };

  return (
    <form
      aria-label="Add a wire"
      onSubmit={submit}
      className="grid gap-3 rounded-lg border border-rule bg-paper-raised p-4"
    >
      <h2 className="text-base font-semibold">Add a wire</h2>
      <div className="flex flex-wrap items-start gap-3">
        <EndField
          autoFocus={focusFirst}
          name="End A"
          value={a}
          options={options}
          byKey={byKey}
          onChange={setA}
        />
        <EndField name="End B" value={b} options={options} byKey={byKey} onChange={setB} />
        <div className="w-28">
          <TextField
            label="Label"
            value={label}
            placeholder="next W-…"
            onChange={(e) => setLabel(e.target.value)}
          />
        </div>
        <div className="w-28">
          <TextField label="Colour" value={colour} onChange={(e) => setColour(e.target.value)} />
        </div>
        <div className="w-28">
          <TextField label="Size (mm²)" value={size} onChange={(e) => setSize(e.target.value)} />
        </div>
      </div>
      {missing && (!a || !b) ? (
        <p className="text-sm text-fault">Pick both ends from the lists.</p>
      ) : null}
      {error ? (
        <p role="alert" className="text-sm text-fault">
          {error}
        </p>
      ) : null}
      <div className="flex gap-2">
        <Button type="submit" variant="primary" busy={busy}>
          Add wire
        </Button>
        <Button variant="quiet" onClick={onClose}>
          Close
        </Button>
      </div>
    </form>
  );
}
