import { useMemo, useState } from 'react';
import { continuityLooksHigh } from '#shared/domain/bench.ts';
import { DISPOSITION_INFO } from '#shared/domain/dispositions.ts';
import { formatWireSize } from '#shared/domain/wire-sizes.ts';
import type { BenchItem, BenchRecordRequest, BenchSheet } from '#shared/schemas/bench.schema.ts';
import type { SizeUnit } from '#shared/schemas/workshop.schema.ts';
import { DispositionGlyph } from '@/components/ui/disposition-glyph.tsx';
import { Notice } from '@/components/ui/notice.tsx';
import { WireColour } from '@/components/ui/wire-colour.tsx';
import { useRecordBenchWork } from '../api/bench.ts';

function Toggle({
  label,
  on,
  disabled,
  onChange,
}: {
  label: string;
  on: boolean;
  disabled: boolean;
  onChange: (on: boolean) => void;
}) {
  return (
    <button
      type="button"
      role="checkbox"
      aria-checked={on}
      disabled={disabled}
      onClick={() => onChange(!on)}
      className={`flex min-h-12 min-w-24 items-center justify-center gap-2 rounded-md border-2 px-3 text-base font-semibold ${
        on ? 'border-sound bg-sound-wash text-sound' : 'border-rule-strong bg-paper text-ink-soft'
      } disabled:opacity-60`}
    >
      <span
        aria-hidden
        className="grid size-6 place-items-center rounded border-2 border-current text-sm"
      >
        {on ? '✓' : ''}
      </span>
      {label}
    </button>
  );
}

function BenchRow({
  item,
  unit,
  canRecord,
  onRecord,
}: {
  item: BenchItem;
  unit: SizeUnit;
  canRecord: boolean;
  onRecord: (change: Omit<BenchRecordRequest, 'version'>) => void;
}) {
  const r = item.record;
  const current = {
    done: r?.done ?? false,
    tested: r?.tested ?? false,
    resistanceOhm: r?.resistanceOhm ?? null,
    note: r?.note ?? '',
  };
  const [reading, setReading] = useState(
    current.resistanceOhm == null ? '' : String(current.resistanceOhm),
  );
  const [readingError, setReadingError] = useState<string | null>(null);
  const info = DISPOSITION_INFO[item.pin.disposition];
  const high =
    current.resistanceOhm != null && continuityLooksHigh(current.resistanceOhm, item.expectedOhm);

  function saveReading() {
    const text = reading.trim().replace(',', '.');
    const value = text === '' ? null : Number(text);
    if (value !== null && (!Number.isFinite(value) || value < 0)) {
      setReadingError('Enter the reading in ohms, e.g. 0.1');
      return;
    }
    setReadingError(null);
    if (value !== current.resistanceOhm)
      onRecord({
        ...current,
        resistanceOhm: value,
        tested: value !== null ? true : current.tested,
      });
  }

  return (
    <li
      className={`rounded-lg border bg-paper-raised p-4 ${current.done ? 'border-sound/50' : 'border-rule'}`}
      data-pin={item.name}
    >
      <div className="flex flex-wrap items-start gap-x-6 gap-y-3">
        <div className="min-w-48 flex-1">
          <p className="flex items-center gap-3">
            <span className="font-mono text-2xl font-bold">{item.name}</span>
            <span className="inline-flex items-center gap-1.5 rounded border border-rule-strong px-2 py-0.5 font-semibold">
              <DispositionGlyph disposition={item.pin.disposition} size={18} />
              {info.label}
            </span>
          </p>
          <p className="mt-1 text-lg">{item.pin.function || '—'}</p>
          <p className="mt-1 flex flex-wrap items-center gap-3 text-ink-soft">
            {item.pin.colour ? <WireColour value={item.pin.colour} /> : null}
            {item.pin.sizeMm2 != null ? (
              <span className="font-mono">{formatWireSize(item.pin.sizeMm2, unit)}</span>
            ) : null}
            {item.destinationLabel ? (
              <span>
                <span aria-hidden>→ </span>
                <span className="sr-only">to </span>
                {item.destinationLabel}
              </span>
            ) : null}
          </p>
          {item.pin.notes ? (
            <p className="mt-1 text-sm text-ink-soft">Plan note: {item.pin.notes}</p>
          ) : null}
        </div>
        <div className="flex flex-wrap items-end gap-3">
          <Toggle
            label="Done"
            on={current.done}
            disabled={!canRecord}
            onChange={(done) => onRecord({ ...current, done })}
          />
          <Toggle
            label="Tested"
            on={current.tested}
            disabled={!canRecord}
            onChange={(tested) => onRecord({ ...current, tested })}
          />
          <label className="flex flex-col text-sm font-medium text-ink-soft">
            Reading, Ω
            <input
              inputMode="decimal"
              className="mt-1 h-12 w-28 rounded-md border-2 border-rule-strong bg-paper px-3 font-mono text-lg text-ink aria-[invalid=true]:border-fault"
              value={reading}
              disabled={!canRecord}
              aria-invalid={readingError ? true : undefined}
              onChange={(e) => setReading(e.target.value)}
              onBlur={saveReading}
              onKeyDown={(e) => e.key === 'Enter' && saveReading()}
            />
          </label>
        </div>
      </div>
      {readingError ? (
        <p className="mt-2 text-sm text-fault">
          <span aria-hidden>✕ </span>
          {readingError}
        </p>
      ) : null}
      {high ? (
        <p className="mt-2 text-sm font-medium text-caution">
          <span aria-hidden>! </span>
          {current.resistanceOhm} Ω is higher than expected
          {item.expectedOhm != null ? ` (wire ≈ ${item.expectedOhm.toFixed(3)} Ω)` : ''}: check the
          crimp and the terminal seating. A short run usually reads about 0–0.2 Ω.
        </p>
      ) : null}
      {r && r.recordedBy ? (
        <p className="mt-2 text-xs text-ink-faint">
          {r.recordedBy}, {new Date(r.recordedAt).toLocaleString()}
          {r.note ? ` · ${r.note}` : ''}
        </p>
      ) : null}
    </li>
  );
}

/** The tablet checklist: every pin of the signed-off revision with its action, ticks and reading. */
export function BenchChecklist({
  conversionId,
  sheet,
  unit,
  canRecord,
}: {
  conversionId: number;
  sheet: BenchSheet;
  unit: SizeUnit;
  canRecord: boolean;
}) {
  const record = useRecordBenchWork(conversionId);
  const [show, setShow] = useState<'open' | 'all'>('open');
  // Pins finished when the list was shown stay hidden; a pin finished now stays in view, so its
  // reading and any warning remain visible until the list is shown again.
  const finishedIds = () =>
    new Set(sheet.items.filter((i) => i.record?.done && i.record?.tested).map((i) => i.pin.id));
  const [hidden, setHidden] = useState(finishedIds);
  const items = useMemo(
    () => (show === 'all' ? sheet.items : sheet.items.filter((i) => !hidden.has(i.pin.id))),
    [sheet.items, show, hidden],
  );
  const pct = sheet.progress.total
    ? Math.round((sheet.progress.done / sheet.progress.total) * 100)
    : 0;
  return (
    <div className="flex flex-col gap-4">
      <div className="sticky top-0 z-10 -mx-1 flex flex-wrap items-center gap-4 bg-paper/95 px-1 py-3 backdrop-blur">
        <div className="min-w-64 flex-1">
          <p className="font-semibold">
            {sheet.progress.done} of {sheet.progress.total} pins done · {sheet.progress.tested}{' '}
            tested
          </p>
          <div
            className="mt-1 h-3 overflow-hidden rounded-full border border-rule-strong bg-paper-sunk"
            aria-hidden
          >
            <div className="h-full bg-sound" style={{ width: `${pct}%` }} />
          </div>
        </div>
        <div role="radiogroup" aria-label="Show" className="flex gap-1">
          {(['open', 'all'] as const).map((v) => (
            <button
              key={v}
              type="button"
              role="radio"
              aria-checked={show === v}
              onClick={() => {
                setShow(v);
                setHidden(finishedIds());
              }}
              className={`min-h-11 rounded-md border px-4 font-medium ${show === v ? 'border-ink bg-ink text-paper' : 'border-rule-strong bg-paper-raised'}`}
            >
              {v === 'open' ? 'Still to do' : 'Every pin'}
            </button>
          ))}
        </div>
      </div>
      {record.error ? (
        <Notice tone="fault" title="That tick was not saved">
          {record.error.message}
        </Notice>
      ) : null}
      {items.length === 0 ? <Notice tone="sound" title="Every pin is done and tested" /> : null}
      <ol className="flex flex-col gap-3">
        {items.map((item) => (
          <BenchRow
            key={item.pin.id}
            item={item}
            unit={unit}
            canRecord={canRecord}
            onRecord={(change) =>
              record.mutate({ revisionNumber: sheet.revision!.number, pinId: item.pin.id, change })
            }
          />
        ))}
      </ol>
    </div>
  );
}
