import { useMemo, useState } from 'react';
import { isDone, isTested } from '#shared/domain/bench.ts';
import { DISPOSITION_INFO } from '#shared/domain/dispositions.ts';
import type {
  BenchItem,
  BenchPhoto,
  BenchRecord,
  BenchRecordRequest,
  BenchSheet,
  BenchTickDef,
} from '#shared/schemas/bench.schema.ts';
import { formatWireSize } from '#shared/domain/wire-sizes.ts';
import type { SizeUnit } from '#shared/schemas/workshop.schema.ts';
import { DispositionGlyph } from '@/components/ui/disposition-glyph.tsx';
import { Notice } from '@/components/ui/notice.tsx';
import { WireColour } from '@/components/ui/wire-colour.tsx';
import { benchPhotoHref, useAddBenchPhoto, useRecordBenchWork } from '../api/bench.ts';

type Change = Omit<BenchRecordRequest, 'version'>;

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

function current(record: BenchRecord | null): Change {
  return { ticks: record?.ticks ?? {}, reading: record?.reading ?? null, note: record?.note ?? '' };
}

function Photos({
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

function ReadingField({
  item,
  record,
  canRecord,
  onRecord,
}: {
  item: BenchItem;
  record: Change;
  canRecord: boolean;
  onRecord: (change: Change) => void;
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

function BenchRow({
  item,
  unit,
  photos,
  canRecord,
  onRecord,
  onPhoto,
}: {
  item: BenchItem;
  unit: SizeUnit;
  photos: BenchPhoto[];
  canRecord: boolean;
  onRecord: (change: Change) => void;
  onPhoto: (file: File) => void;
}) {
  const r = item.record;
  const now = current(r);
  const done = isDone(item, now.ticks);
  const high = item.reading && now.reading != null && now.reading > item.reading.limitOhm + 1e-9;
  const rework = r?.rework;
  return (
    <li
      className={`rounded-lg border bg-paper-raised p-4 ${rework && !done ? 'border-2 border-caution' : done ? 'border-sound/50' : 'border-rule'}`}
      data-item={item.key}
      data-pin={item.pin ? item.name : undefined}
    >
      {rework ? (
        <div className="mb-3 rounded-md bg-caution-wash px-3 py-2 text-caution">
          <p className="font-semibold">
            <span aria-hidden>! </span>Rework: changed since revision {rework.fromRevision}
          </p>
          <p>
            <span className="font-semibold">Was:</span> {rework.was}
          </p>
          <p>
            <span className="font-semibold">Now:</span> {item.asked}
          </p>
        </div>
      ) : null}
      <div className="flex flex-wrap items-start gap-x-6 gap-y-3">
        <div className="min-w-48 flex-1">
          <p className="flex flex-wrap items-center gap-3">
            <span className="font-mono text-2xl font-bold">{item.name}</span>
            {item.pin ? (
              <span className="inline-flex items-center gap-1.5 rounded border border-rule-strong px-2 py-0.5 font-semibold">
                <DispositionGlyph disposition={item.pin.disposition} size={18} />
                {DISPOSITION_INFO[item.pin.disposition].label}
              </span>
            ) : (
              <span className="rounded border border-rule-strong px-2 py-0.5 font-semibold">
                New feed
              </span>
            )}
            {r?.carriedFrom ? (
              <span className="text-sm text-ink-faint">carried from revision {r.carriedFrom}</span>
            ) : null}
          </p>
          <p className="mt-1 text-lg">{item.pin ? item.pin.function || '—' : item.asked}</p>
          {item.pin ? (
            <p className="mt-1 flex flex-wrap items-center gap-3 text-ink-soft">
              {item.pin.colour ? <WireColour value={item.pin.colour} /> : null}
              {item.pin.sizeMm2 != null ? (
                <span className="font-mono">{formatWireSize(item.pin.sizeMm2, unit)}</span>
              ) : null}
              {item.pin.runLengthM != null && item.reading ? (
                <span className="font-mono">{item.pin.runLengthM} m</span>
              ) : null}
              {item.destinationLabel ? (
                <span>
                  <span aria-hidden>→ </span>
                  <span className="sr-only">to </span>
                  {item.destinationLabel}
                </span>
              ) : null}
            </p>
          ) : null}
          {item.pin?.notes ? (
            <p className="mt-1 text-sm text-ink-soft">Plan note: {item.pin.notes}</p>
          ) : null}
        </div>
        <div className="flex flex-wrap items-end gap-3">
          {item.ticks.map((t: BenchTickDef) => (
            <Toggle
              key={t.key}
              label={t.label}
              on={now.ticks[t.key] === true}
              disabled={!canRecord}
              onChange={(on) => onRecord({ ...now, ticks: { ...now.ticks, [t.key]: on } })}
            />
          ))}
          {item.reading ? (
            <ReadingField item={item} record={now} canRecord={canRecord} onRecord={onRecord} />
          ) : null}
        </div>
      </div>
      {high ? (
        <p className="mt-2 text-sm font-medium text-fault">
          <span aria-hidden>✕ </span>
          Fail: {now.reading} Ω is above the limit of {item.reading!.limitOhm.toFixed(3)} Ω. Check
          the crimp and the terminal seating, and say what you found.
        </p>
      ) : null}
      {high ? (
        <NoteField
          note={now.note}
          disabled={!canRecord}
          onSave={(note) => onRecord({ ...now, note })}
        />
      ) : null}
      {r &&
      r.version >= 0 &&
      (Object.values(r.ticks).some(Boolean) || r.reading != null) &&
      !high ? (
        <p className="mt-2 text-xs text-ink-faint">
          {r.recordedBy}
          {r.recordedAt ? `, ${new Date(r.recordedAt).toLocaleString()}` : ''}
          {r.note ? ` · ${r.note}` : ''}
        </p>
      ) : null}
      <Photos photos={photos} canRecord={canRecord} onAdd={onPhoto} label={item.name} />
    </li>
  );
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

/** The tablet checklist: rework first, then what to take out, then every item with its ticks. */
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
  const photo = useAddBenchPhoto(conversionId, sheet.revision!.number);
  const writable = canRecord && sheet.revision!.current;
  const [show, setShow] = useState<'open' | 'all'>('open');
  // Items finished when the list was shown stay hidden; one finished now stays in view, so its
  // reading and any warning remain visible until the list is shown again.
  const finishedKeys = () =>
    new Set(
      sheet.items
        .filter(
          (i) =>
            isDone(i, i.record?.ticks) &&
            (isTested(i, i.record?.ticks) || !i.ticks.some((t) => t.key === 'tested')),
        )
        .map((i) => i.key),
    );
  const [hidden, setHidden] = useState(finishedKeys);
  const items = useMemo(
    () => (show === 'all' ? sheet.items : sheet.items.filter((i) => !hidden.has(i.key))),
    [sheet.items, show, hidden],
  );
  const pct = sheet.progress.total
    ? Math.round((sheet.progress.done / sheet.progress.total) * 100)
    : 0;
  const send = (key: string, name: string, base: BenchRecord | null, change: Change) =>
    record.mutate({
      conversionId,
      revisionNumber: sheet.revision!.number,
      key,
      name,
      change,
      baseVersion: base == null || base.version < 0 ? null : base.version,
    });
  const row = (item: BenchItem) => (
    <BenchRow
      key={item.key}
      item={item}
      unit={unit}
      photos={sheet.photos[item.key] ?? []}
      canRecord={writable}
      onRecord={(change) => send(item.key, item.name, item.record, change)}
      onPhoto={(file) => photo.mutate({ key: item.key, file })}
    />
  );
  return (
    <div className="flex flex-col gap-4">
      <div className="sticky top-0 z-10 -mx-1 flex flex-wrap items-center gap-4 bg-paper/95 px-1 py-3 backdrop-blur">
        <div className="min-w-64 flex-1">
          <p className="font-semibold">
            {sheet.progress.done} of {sheet.progress.total} done · {sheet.progress.tested} tested
            {sheet.progress.rework ? ` · ${sheet.progress.rework} to rework` : ''}
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
                setHidden(finishedKeys());
              }}
              className={`min-h-11 rounded-md border px-4 font-medium ${show === v ? 'border-ink bg-ink text-paper' : 'border-rule-strong bg-paper-raised'}`}
            >
              {v === 'open' ? 'Still to do' : 'Everything'}
            </button>
          ))}
        </div>
      </div>
      {photo.error ? (
        <Notice tone="fault" title="The photo was not saved">
          {photo.error.message}
        </Notice>
      ) : null}
      {sheet.rework.length ? (
        <section aria-labelledby="rework-heading" className="flex flex-col gap-3">
          <h3 id="rework-heading" className="text-lg font-semibold">
            Rework: changed since the work was done
          </h3>
          <p className="text-ink-soft">
            These items were worked on an earlier revision and have changed since. Undo what was
            done where needed, do what is now asked and tick them again.
          </p>
          <ol className="flex flex-col gap-3">{sheet.rework.map(row)}</ol>
        </section>
      ) : null}
      {sheet.removed.length ? (
        <section aria-labelledby="removed-heading" className="flex flex-col gap-3">
          <h3 id="removed-heading" className="text-lg font-semibold">
            Taken out of the plan
          </h3>
          <ol className="flex flex-col gap-3">
            {sheet.removed.map((r) => (
              <li
                key={r.key}
                data-item={r.key}
                className="rounded-lg border-2 border-caution bg-paper-raised p-4"
              >
                <p className="font-mono text-2xl font-bold">{r.rework.name}</p>
                <p>
                  <span className="font-semibold">Was (revision {r.rework.fromRevision}):</span>{' '}
                  {r.rework.was}
                </p>
                <p>
                  <span className="font-semibold">Now:</span> no longer in the plan; take out what
                  was built.
                </p>
                <div className="mt-2">
                  <Toggle
                    label="Taken out"
                    on={r.record.ticks.done === true}
                    disabled={!writable}
                    onChange={(on) =>
                      send(r.key, r.rework.name, r.record, {
                        ...current(r.record),
                        ticks: { done: on },
                      })
                    }
                  />
                </div>
              </li>
            ))}
          </ol>
        </section>
      ) : null}
      {items.length === 0 ? <Notice tone="sound" title="Everything is done and tested" /> : null}
      <ol className="flex flex-col gap-3" aria-label="Checklist">
        {items.map(row)}
      </ol>
    </div>
  );
}
