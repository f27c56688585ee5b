import { Link, useOutletContext, useParams } from 'react-router-dom';
import type { Conversion } from '#shared/schemas/conversions.schema.ts';
import { Button } from '@/components/ui/button.tsx';
import { Loading } from '@/components/ui/loading.tsx';
import { Notice } from '@/components/ui/notice.tsx';
import { paths } from '@/config/paths.ts';
import { ApiError } from '@/lib/api-client.ts';
import { useSession } from '@/features/auth/api/get-session.ts';
import { useCan } from '@/features/auth/hooks/use-can.ts';
import { useRevisionBenchSheet } from '@/features/bench/api/bench.ts';
import { BenchPhotosPanel } from '@/features/bench/components/bench-photos-panel.tsx';
import {
  revisionWorksheetHref,
  useRevision,
  useVerifyRevision,
} from '@/features/revisions/api/revisions.ts';
import { ChangesView } from '@/features/revisions/components/changes-view.tsx';
import { CommentsPanel } from '@/features/revisions/components/comments-panel.tsx';
import { EarlierComments } from '@/features/revisions/components/earlier-comments.tsx';
import { FrozenFindings } from '@/features/revisions/components/frozen-findings.tsx';
import { FrozenPlan } from '@/features/revisions/components/frozen-plan.tsx';
import { ReviewActions } from '@/features/revisions/components/review-actions.tsx';
import { RevisionStatusBadge } from '@/features/revisions/components/revision-status.tsx';
import { useWorkshop } from '@/features/workshop/api/workshop.ts';
import { formatDate } from '@/lib/format-date.ts';

export function ConversionRevisionRoute() {
  const conversion = useOutletContext<Conversion>();
  const number = Number(useParams().number);
  const revision = useRevision(conversion.id, number);
  const verify = useVerifyRevision(conversion.id, number);
  const session = useSession();
  const workshop = useWorkshop();
  const mayReview = useCan('revision:review');
  const mayComment = useCan('revision:comment');
  const mayAnswer = useCan('revision:submit');
  const bench = useRevisionBenchSheet(
    conversion.id,
    number,
    revision.data?.status === 'signed_off',
  );

  if (revision.isPending) return <Loading what={`Loading revision ${number}`} />;
  if (revision.isError) {
    if (revision.error instanceof ApiError && revision.error.code === 'seal_mismatch') {
      return (
        <div role="alert" className="rounded-lg border-4 border-fault bg-paper-raised p-6">
          <h2 className="text-2xl font-bold text-fault">
            Revision {number} does not match its seal
          </h2>
          <p className="mt-3 max-w-2xl">{revision.error.message}</p>
          <p className="mt-3 max-w-2xl font-semibold">
            Do not build from this revision or from any printout of it.
          </p>
        </div>
      );
    }
    return (
      <Notice tone="fault" title={`Revision ${number} could not be loaded`}>
        {revision.error.message}
      </Notice>
    );
  }
  const r = revision.data;
  // On a first revision the whole plan is what is reviewed: it comes first. Later, the changes do.
  const frozenPlan = (
    <FrozenPlan
      snapshot={r.snapshot}
      revisionNumber={r.number}
      unit={workshop.data?.sizeUnit ?? 'mm2'}
    />
  );
  return (
    <div className="flex flex-col gap-6">
      <p>
        <Link className="text-sm underline" to={paths.conversionRevisions.getHref(conversion.id)}>
          ← All revisions
        </Link>
      </p>
      <section className="flex flex-wrap items-start justify-between gap-4 rounded-lg border border-rule bg-paper-raised p-5">
        <div>
          <h2 className="flex items-center gap-3 text-xl font-semibold">
            Revision {r.number} <RevisionStatusBadge status={r.status} />
          </h2>
          <p className="mt-1 text-sm text-ink-soft">
            Submitted by {r.submittedBy} on {formatDate(r.submittedAt)}
            {r.reviewedBy ? ` · reviewed by ${r.reviewedBy} on ${formatDate(r.reviewedAt)}` : ''}
          </p>
          {r.reviewComment ? (
            <p className="mt-2 max-w-2xl whitespace-pre-wrap border-l-2 border-rule-strong pl-3 text-sm">
              {r.reviewComment}
            </p>
          ) : null}
          <p className="mt-3 break-all font-mono text-xs text-ink-soft">SHA-256 {r.hash}</p>
          {r.seal ? (
            <p className="mt-1 break-all font-mono text-xs text-ink-soft">
              Sealed by this server&rsquo;s {r.seal.algorithm} key {r.seal.publicKey} (key print{' '}
              {r.seal.fingerprint}); the seal was checked when this page loaded.
            </p>
          ) : (
            <p className="mt-1 text-xs text-ink-soft">Sealed when a reviewer decides.</p>
          )}
          <div className="mt-2 flex flex-wrap items-center gap-3">
            <Button size="sm" busy={verify.isFetching} onClick={() => void verify.refetch()}>
              {r.seal ? 'Verify hash and seal' : 'Verify content hash'}
            </Button>
            {verify.data ? (
              verify.data.ok ? (
                <span className="text-sm text-sound">
                  <span aria-hidden>✓ </span>
                  {verify.data.sealed
                    ? 'The stored content still hashes to this value and matches its seal.'
                    : 'The stored content still hashes to this value.'}
                </span>
              ) : (
                <span className="text-sm text-fault">
                  <span aria-hidden>✕ </span>Mismatch: {verify.data.problem}.
                </span>
              )
            ) : null}
          </div>
        </div>
        <a
          className="rounded-md border border-rule-strong bg-paper px-4 py-2 font-medium hover:bg-paper-sunk"
          href={revisionWorksheetHref(conversion.id, r.number)}
          target="_blank"
          rel="noopener"
        >
          Print worksheet
        </a>
      </section>
      {mayReview && session.data ? (
        <ReviewActions conversionId={conversion.id} revision={r} reviewerName={session.data.name} />
      ) : null}
      {r.changes && r.comparedWith ? (
        <ChangesView
          changes={r.changes}
          comparedWith={r.comparedWith}
          unit={workshop.data?.sizeUnit ?? 'mm2'}
        />
      ) : (
        <Notice
          tone="info"
          title={r.number === 1 ? 'First revision for review' : 'Nothing signed off before this'}
        >
          There is no earlier signed-off revision to compare with: review the whole plan, as frozen
          below.
        </Notice>
      )}
      {r.changes ? null : frozenPlan}
      {bench.data ? <BenchPhotosPanel sheet={bench.data} /> : null}
      <FrozenFindings findings={r.findings} />
      <EarlierComments conversionId={conversion.id} revision={r} canAnswer={mayAnswer} />
      <CommentsPanel conversionId={conversion.id} revision={r} canComment={mayComment} />
      {r.changes ? (
        <FrozenPlan
          snapshot={r.snapshot}
          revisionNumber={r.number}
          unit={workshop.data?.sizeUnit ?? 'mm2'}
          collapsed
        />
      ) : null}
    </div>
  );
}
