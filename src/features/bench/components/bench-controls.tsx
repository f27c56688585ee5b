import { useState } from 'react';
import type { BenchItem, BenchPhoto, BenchRecordRequest } from '#shared/schemas/bench.schema.ts';
import { benchPhotoHref } from '../api/bench.ts';

/** What a builder records on one item: the ticks, the reading and a note. */
export type BenchChange = Omit<BenchRecordRequest, 'version'>;

export function Toggle({
  label,
  on,
  disabled,
  onChange,
  tone = 'sound',
}: {
  label: string;
  on: boolean;
  disabled: boolean;
  onChange: (on: boolean) => void;
  tone?: 'sound' | 'fault';
}) {
  const onClass =
    tone === 'sound'
      ? 'border-sound bg-sound-wash text-sound'
      : 'border-fault bg-fault-wash text-fault';
  return (
    <button
      type="button"
      role="checkbox"
      aria-checked={on}
      disabled={disabled}
      onClick={() => onChange(!on)}
      className={`flex min-h-12 min-w-24 items-center justify-center gap-2 rounded-md border-2 px-3 text-base font-semibold ${
        on ? onClass : 'border-rule-strong bg-paper text-ink-soft'
      } disabled:opacity-60`}
    >
      <span
        aria-hidden
        className="grid size-6 place-items-center rounded border-2 border-current text-sm"
      >
        {on ? (tone === 'sound' ? '✓' : '✕') : ''}
      </span>
      {label}
    </button>
  );
}

/** A decimal typed on a tablet keyboard: comma or point; null when empty, NaN when not a number. */
export function parseReading(text: string): number | null {
  const t = text.trim().replace(',', '.');
  if (t === '') return null;
  return /^-?\d*\.?\d+$/.test(t) ? Number(t) : NaN;
}

export function NoteField({
  note,
  disabled,
  onSave,
}: {
  note: string;
  disabled: boolean;
  onSave: (note: string) => void;
}) {
  const [text, setText] = useState(note);
  return (
    <label className="mt-2 flex flex-col text-sm font-medium text-ink-soft">
      What was found
      <textarea
        className="mt-1 min-h-16 rounded-md border-2 border-rule-strong bg-paper px-3 py-2 text-base text-ink"
        maxLength={500}
        value={text}
        disabled={disabled}
        onChange={(e) => setText(e.target.value)}
        onBlur={() => text.trim() !== note && onSave(text.trim())}
      />
    </label>
  );
}

export function Photos({
  photos,
  canRecord,
  onAdd,
  label,
}: {
  photos: BenchPhoto[];
  canRecord: boolean;
  onAdd: (file: File) => void;
  label: string;
}) {
  return (
    <div className="mt-3 flex flex-wrap items-center gap-3">
      {photos.map((p) => (
        <a key={p.id} href={benchPhotoHref(p.id)} target="_blank" rel="noopener">
          <img
            src={benchPhotoHref(p.id)}
            alt={`Photo of ${label} by ${p.takenBy ?? 'someone'}`}
            className="size-16 rounded border border-rule-strong object-cover"
          />
        </a>
      ))}
      {canRecord ? (
        <label className="flex min-h-11 cursor-pointer items-center gap-2 rounded-md border border-rule-strong bg-paper px-3 text-sm font-medium text-ink-soft hover:bg-paper-sunk">
          <span aria-hidden>▣</span> Add photo
          <input
            type="file"
            accept="image/jpeg,image/png"
            capture="environment"
            className="sr-only"
            aria-label={`Photo of ${label}`}
            onChange={(e) => {
              const file = e.target.files?.[0];
              if (file) onAdd(file);
              e.target.value = '';
            }}
          />
        </label>
      ) : null}
    </div>
  );
}

export function ReadingField({
  item,
  record,
  canRecord,
  onRecord,
}: {
  item: BenchItem;
  record: BenchChange;
  canRecord: boolean;
  onRecord: (change: BenchChange) => void;
}) {
  const [text, setText] = useState(record.reading == null ? '' : String(record.reading));
  const [error, setError] = useState<string | null>(null);
  const limit = item.reading!.limitOhm;
  const high = record.reading != null && record.reading > limit + 1e-9;

  function save() {
    const value = parseReading(text);
    if (value !== null && (!Number.isFinite(value) || value < 0)) {
      setError('Enter the reading in ohms, e.g. 0.1');
      return;
    }
    setError(null);
    if (value !== record.reading) {
      onRecord({
        ...record,
        reading: value,
        ticks: { ...record.ticks, tested: value !== null ? true : record.ticks.tested },
      });
    }
  }

  return (
    <div className="flex flex-col">
      <label className="flex flex-col text-sm font-medium text-ink-soft">
        Reading, Ω
        <input
          inputMode="decimal"
          className="mt-1 h-12 w-28 rounded-md border-2 border-rule-strong bg-paper px-3 font-mono text-lg text-ink aria-[invalid=true]:border-fault"
          value={text}
          disabled={!canRecord}
          aria-invalid={error || high ? true : undefined}
          onChange={(e) => setText(e.target.value)}
          onBlur={save}
          onKeyDown={(e) => e.key === 'Enter' && save()}
        />
      </label>
      <span className="mt-1 text-xs text-ink-faint">
        {item.reading!.expectedOhm != null
          ? `wire ≈ ${item.reading!.expectedOhm.toFixed(3)} Ω · `
          : ''}
        pass ≤ {limit.toFixed(3)} Ω
      </span>
      {error ? (
        <p className="mt-1 text-sm text-fault">
          <span aria-hidden>✕ </span>
          {error}
        </p>
      ) : null}
    </div>
  );
}
