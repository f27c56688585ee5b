import { BENCH_KIND_LABELS, isDone } from '#shared/domain/bench.ts';
import { DISPOSITION_INFO } from '#shared/domain/dispositions.ts';
import { formatWireSize } from '#shared/domain/wire-sizes.ts';
import type {
  BenchItem,
  BenchPhoto,
  BenchRecord,
  BenchTickDef,
} from '#shared/schemas/bench.schema.ts';
import type { SizeUnit } from '#shared/schemas/workshop.schema.ts';
import { DispositionGlyph } from '@/components/ui/disposition-glyph.tsx';
import { WireColour } from '@/components/ui/wire-colour.tsx';
import { NoteField, Photos, ReadingField, Toggle, type BenchChange } from './bench-controls.tsx';
import { formatDate } from '@/lib/format-date.ts';

/** The record as it stands, or an empty one. */
export function current(record: BenchRecord | null): BenchChange {
  return { ticks: record?.ticks ?? {}, reading: record?.reading ?? null, note: record?.note ?? '' };
}

/** One item of the checklist: what is asked, its ticks, reading and photos. */
export function BenchRow({
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
  onRecord: (change: BenchChange) => void;
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
                {BENCH_KIND_LABELS[item.kind]}
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
          {r.recordedAt ? `, ${formatDate(r.recordedAt)}` : ''}
          {r.note ? ` · ${r.note}` : ''}
        </p>
      ) : null}
      <Photos photos={photos} canRecord={canRecord} onAdd={onPhoto} label={item.name} />
    </li>
  );
}
