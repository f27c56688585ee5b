import { useMemo, useState } from 'react';
import { isDone, isTested } from '#shared/domain/bench.ts';
import type { BenchItem, BenchRecord, BenchSheet } from '#shared/schemas/bench.schema.ts';
import type { SizeUnit } from '#shared/schemas/workshop.schema.ts';
import { Notice } from '@/components/ui/notice.tsx';
import { useAddBenchPhoto, useRecordBenchWork } from '../api/bench.ts';
import { Toggle, type BenchChange } from './bench-controls.tsx';
import { BenchRow, current } from './bench-row.tsx';

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
  const send = (key: string, name: string, base: BenchRecord | null, change: BenchChange) =>
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
