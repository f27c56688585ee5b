import type { BenchSheet } from '#shared/schemas/bench.schema.ts';
import { benchPhotoHref } from '../api/bench.ts';
import { formatDate } from '@/lib/format-date.ts';

/** For the reviewer: how far the bench is on this revision, and the photos taken there. */
export function BenchPhotosPanel({ sheet }: { sheet: BenchSheet }) {
  const names = new Map([...sheet.rework, ...sheet.items].map((i) => [i.key, i.name] as const));
  for (const r of sheet.removed) names.set(r.key, r.rework.name);
  const groups = Object.entries(sheet.photos);
  return (
    <section
      aria-labelledby="bench-photos-heading"
      className="rounded-lg border border-rule bg-paper-raised p-5"
    >
      <h3 id="bench-photos-heading" className="text-lg font-semibold">
        At the bench
      </h3>
      <p className="text-sm text-ink-soft">
        {sheet.progress.done} of {sheet.progress.total} done · {sheet.progress.tested} tested
        {sheet.progress.rework ? ` · ${sheet.progress.rework} to rework` : ''}
      </p>
      {groups.length === 0 ? (
        <p className="mt-3 text-ink-soft">No photos taken at the bench yet.</p>
      ) : (
        <ul className="mt-3 flex flex-wrap gap-4">
          {groups.flatMap(([key, photos]) =>
            photos.map((p) => (
              <li key={p.id} className="flex w-44 flex-col gap-1">
                <a href={benchPhotoHref(p.id)} target="_blank" rel="noopener">
                  <img
                    src={benchPhotoHref(p.id)}
                    alt={`Bench photo of ${names.get(key) ?? key}`}
                    className="h-32 w-44 rounded border border-rule-strong object-cover"
                  />
                </a>
                <span className="font-mono font-semibold">{names.get(key) ?? key}</span>
                <span className="text-xs text-ink-faint">
                  {p.takenBy ?? '—'}, {formatDate(p.createdAt)}
                </span>
              </li>
            )),
          )}
        </ul>
      )}
    </section>
  );
}
