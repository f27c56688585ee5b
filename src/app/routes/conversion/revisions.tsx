import { useNavigate, useOutletContext } from 'react-router-dom';
import type { Conversion } from '#shared/schemas/conversions.schema.ts';
import { Loading } from '@/components/ui/loading.tsx';
import { Notice } from '@/components/ui/notice.tsx';
import { paths } from '@/config/paths.ts';
import { useCan } from '@/features/auth/hooks/use-can.ts';
import { revisionWorksheetHref, useRevisions } from '@/features/revisions/api/revisions.ts';
import { RevisionsTable } from '@/features/revisions/components/revisions-table.tsx';
import { SubmitPanel } from '@/features/revisions/components/submit-panel.tsx';
import { formatDate } from '@/lib/format-date.ts';

export function ConversionRevisionsRoute() {
  const conversion = useOutletContext<Conversion>();
  const revisions = useRevisions(conversion.id);
  const maySubmit = useCan('revision:submit');
  const navigate = useNavigate();

  if (revisions.isPending) return <Loading what="Loading revisions" />;
  if (revisions.isError) {
    return (
      <Notice tone="fault" title="Revisions could not be loaded">
        {revisions.error.message}
      </Notice>
    );
  }
  const current = revisions.data.find((r) => r.status === 'signed_off');
  const waiting = revisions.data.find((r) => r.status === 'in_review');
  return (
    <div className="flex flex-col gap-6">
      {current ? (
        <div className="flex flex-wrap items-center justify-between gap-4 rounded-lg border border-sound/40 bg-sound-wash px-5 py-4">
          <div>
            <p className="font-semibold">
              <span aria-hidden>✓ </span>The bench works from revision {current.number}
            </p>
            <p className="text-sm text-ink-soft">
              Signed off by {current.reviewedBy} on {formatDate(current.signedAt, 'date')} · hash{' '}
              <span className="font-mono">{current.hash.slice(0, 12)}</span>
            </p>
          </div>
          <a
            className="rounded-md border border-copper-deep bg-copper px-4 py-2 font-medium text-white hover:bg-copper-deep"
            href={revisionWorksheetHref(conversion.id, current.number)}
            target="_blank"
            rel="noopener"
          >
            Print bench worksheet (revision {current.number})
          </a>
        </div>
      ) : (
        <Notice tone="caution" title="Nothing signed off yet">
          No wire should be cut until a reviewer has signed off a revision of this plan.
        </Notice>
      )}
      {waiting ? (
        <Notice tone="info" title={`Revision ${waiting.number} is waiting for review`}>
          Submitted by {waiting.submittedBy}. A reviewer signs it off or sends it back before
          another can be submitted.
        </Notice>
      ) : maySubmit ? (
        <SubmitPanel
          conversionId={conversion.id}
          checksHref={paths.conversionChecks.getHref(conversion.id)}
          onSubmitted={(n) => navigate(paths.conversionRevision.getHref(conversion.id, n))}
        />
      ) : null}
      <RevisionsTable
        revisions={revisions.data}
        hrefFor={(n) => paths.conversionRevision.getHref(conversion.id, n)}
      />
    </div>
  );
}
