import type { ReactNode } from 'react';
import { Link, useOutletContext } from 'react-router-dom';
import type { Conversion } from '#shared/schemas/conversions.schema.ts';
import { paths } from '@/config/paths.ts';
import { useCan } from '@/features/auth/hooks/use-can.ts';
import { useFeeds } from '@/features/feeds/api/get-feeds.ts';
import { useConnectors } from '@/features/pin-map/api/get-connectors.ts';
import { usePins } from '@/features/pin-map/api/get-pins.ts';
import { useRevisions } from '@/features/revisions/api/revisions.ts';
import { RevisionStatusBadge } from '@/features/revisions/components/revision-status.tsx';
import { formatDate } from '@/lib/format-date.ts';
import { plural } from '@/lib/plural.ts';

/** The current draft's bench worksheet; the session cookie goes with the new tab's request. */
const draftWorksheetHref = (conversionId: number) =>
  `/api/conversions/${conversionId}/worksheet.pdf`;

function Glance({ title, to, children }: { title: string; to: string; children: ReactNode }) {
  return (
    <Link
      to={to}
      className="flex flex-col gap-1 rounded-lg border border-rule bg-paper-raised p-4 hover:border-rule-strong hover:bg-paper-sunk/40"
    >
      <span className="text-sm font-medium text-ink-soft">{title}</span>
      <span className="text-lg font-semibold">{children}</span>
    </Link>
  );
}

/** Where the conversion stands: pins decided, feeds, the latest revision; its notes. */
export function ConversionOverviewRoute() {
  const c = useOutletContext<Conversion>();
  const canPrint = useCan('worksheet:print');
  const connectors = useConnectors(c.id);
  // Counted from the pins, which the pin map keeps current as it saves.
  const pins = usePins(c.id);
  const feeds = useFeeds(c.id);
  const revisions = useRevisions(c.id);

  const cavities = pins.data?.length ?? 0;
  const undecided = (pins.data ?? []).filter((p) => p.disposition === 'undecided').length;
  const latest = revisions.data?.[0];

  return (
    <div className="flex max-w-4xl flex-col gap-5">
      <div className="grid gap-3 sm:grid-cols-3">
        <Glance title="Pin map" to={paths.conversionPins.getHref(c.id)}>
          {connectors.data && pins.data ? (
            <>
              {cavities - undecided} of {plural(cavities, 'pin')} decided
              <span className="block text-sm font-normal text-ink-soft">
                on {plural(connectors.data.length, 'connector')}
                {undecided ? ` · ${undecided} still undecided` : ''}
              </span>
            </>
          ) : (
            '…'
          )}
        </Glance>
        <Glance title="New fused feeds" to={paths.conversionFeeds.getHref(c.id)}>
          {feeds.data ? plural(feeds.data.length, 'feed') : '…'}
          <span className="block text-sm font-normal text-ink-soft">
            fuses, relays, wires, loads
          </span>
        </Glance>
        <Glance title="Review" to={paths.conversionRevisions.getHref(c.id)}>
          {revisions.data ? (
            latest ? (
              <>
                Revision {latest.number} <RevisionStatusBadge status={latest.status} />
              </>
            ) : (
              'Not submitted yet'
            )
          ) : (
            '…'
          )}
        </Glance>
      </div>
      {canPrint ? (
        <div className="flex flex-wrap items-center gap-x-4 gap-y-2">
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
        className="rounded-lg border border-rule bg-paper-raised p-5"
      >
        <h2 id="notes-heading" className="mb-2 font-semibold">
          Notes
        </h2>
        <p className="whitespace-pre-wrap text-ink-soft">{c.notes || 'No notes.'}</p>
        <p className="mt-4 text-sm text-ink-faint">
          Started by {c.createdBy?.name ?? 'someone no longer here'} · last changed{' '}
          {formatDate(c.updatedAt)}
        </p>
      </section>
    </div>
  );
}
