import { useOutletContext } from 'react-router';
import type { Conversion } from '#shared/schemas/conversions.schema.ts';
import { useCan } from '@/features/auth/hooks/use-can.ts';

/** The current draft's bench worksheet; the session cookie goes with the new tab's request. */
const draftWorksheetHref = (conversionId: number) =>
  `/api/conversions/${conversionId}/worksheet.pdf`;

export function ConversionOverviewRoute() {
  const c = useOutletContext<Conversion>();
  const canPrint = useCan('worksheet:print');
  return (
    <>
      {canPrint ? (
        <div className="mb-4 flex max-w-3xl flex-wrap items-center gap-x-4 gap-y-2">
          <a
            className="inline-flex min-h-11 items-center rounded-md border border-rule-strong bg-paper-raised px-4 font-medium hover:bg-paper-sunk"
            href={draftWorksheetHref(c.id)}
            target="_blank"
            rel="noopener"
          >
            Print bench worksheet
          </a>
          <p className="text-sm text-ink-soft">
            Prints the plan as it stands now, marked DRAFT. Bench work goes by a signed-off
            revision.
          </p>
        </div>
      ) : null}
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
    </>
  );
}
