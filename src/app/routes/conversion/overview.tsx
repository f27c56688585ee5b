import { useOutletContext } from 'react-router';
import type { Conversion } from '#shared/schemas/conversions.schema.ts';

export function ConversionOverviewRoute() {
  const c = useOutletContext<Conversion>();
  return (
    <section
      aria-labelledby="notes-heading"
      className="max-w-3xl rounded-lg border border-rule bg-paper-raised p-5"
    >
      <h2 id="notes-heading" className="mb-2 font-semibold">
        Notes
      </h2>
      <p className="whitespace-pre-wrap text-ink-soft">{c.notes || 'No notes.'}</p>
      <p className="mt-4 text-sm text-ink-faint">
        Started by {c.createdBy?.name ?? 'someone no longer here'} · last changed{' '}
        {new Date(c.updatedAt).toLocaleString()}
      </p>
    </section>
  );
}
