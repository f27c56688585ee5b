import { useEffect, useMemo, useState } from 'react';
import { useLocation } from 'react-router-dom';
import { SEVERITIES } from '#shared/schemas/checks.schema.ts';
import type { Feed } from '#shared/schemas/feeds.schema.ts';
import type { Connector, Pin } from '#shared/schemas/pin-map.schema.ts';
import { Button } from '@/components/ui/button.tsx';
import { Loading } from '@/components/ui/loading.tsx';
import { Notice } from '@/components/ui/notice.tsx';
import { AllClearLabel, SeverityLabel } from '@/components/ui/severity.tsx';
import { pinNames } from '#shared/domain/pin-names.ts';
import { paths } from '@/config/paths.ts';
import { useCheckReport } from '../api/run-checks.ts';
import {
  countsSentence,
  hasUnfusedFinding,
  sortFindings,
  subjectLinks,
  type SubjectLink,
} from '../lib/findings.ts';
import { FindingRow } from './finding-row.tsx';
import { SafetyCautions } from './safety-cautions.tsx';
import { formatDate } from '@/lib/format-date.ts';

export function CheckedAt({ iso }: { iso: string }) {
  return (
    <time dateTime={iso} className="whitespace-nowrap">
      {formatDate(iso, 'dateTimeSeconds')}
    </time>
  );
}

/**
 * The findings of every circuit check on a conversion, run when the page opens and on demand. The
 * pins, connectors and feeds name the findings' links; undefined until loaded (or not needed).
 */
export function ChecksPanel({
  conversionId,
  pins,
  connectors,
  feeds,
}: {
  conversionId: number;
  pins: readonly Pin[] | undefined;
  connectors: readonly Connector[] | undefined;
  feeds: readonly Feed[] | undefined;
}) {
  const report = useCheckReport(conversionId);
  const location = useLocation();
  const focus = decodeURIComponent(location.hash.replace(/^#/, ''));
  const [open, setOpen] = useState<Set<string>>(() => new Set(focus ? [focus] : []));

  const findings = useMemo(() => sortFindings(report.data?.findings ?? []), [report.data]);

  const names = useMemo(() => {
    const pinName = pinNames({ connectors: connectors ?? [], pins: pins ?? [] });
    const feedName = new Map((feeds ?? []).map((f) => [f.id, f.name]));
    return { pin: (id: number) => pinName.get(id), feed: (id: number) => feedName.get(id) };
  }, [pins, connectors, feeds]);

  const hrefOf = (link: SubjectLink) =>
    link.kind === 'pin'
      ? `${paths.conversionPins.getHref(conversionId)}?pin=${link.id}`
      : `${paths.conversionFeeds.getHref(conversionId)}?feed=${link.id}`;

  const hasReport = report.data !== undefined;
  useEffect(() => {
    // Opened from a link to one finding: bring it into view once the report is there.
    if (focus && hasReport) document.getElementById(focus)?.scrollIntoView({ block: 'start' });
  }, [focus, hasReport]);

  const toggle = (id: string) =>
    setOpen((current) => {
      const next = new Set(current);
      if (next.has(id)) next.delete(id);
      else next.add(id);
      return next;
    });

  return (
    <section aria-labelledby="checks-heading" className="grid gap-5">
      <div className="flex flex-wrap items-end justify-between gap-4">
        <div>
          <h2 id="checks-heading" className="text-xl font-semibold">
            Circuit checks
          </h2>
          <p className="mt-1 max-w-2xl text-sm text-ink-soft">
            Fuses against wires and loads, relay contacts, voltage drop, unfused feeds, sensor
            grounds, undecided pins and destinations, each with its working and source.
          </p>
        </div>
        <div className="flex items-center gap-3">
          <p role="status" className="text-sm text-ink-faint">
            {report.isFetching ? (
              'Checking…'
            ) : report.data ? (
              <>
                Checked <CheckedAt iso={report.data.checkedAt} />
              </>
            ) : null}
          </p>
          <Button variant="primary" busy={report.isFetching} onClick={() => void report.refetch()}>
            Run checks
          </Button>
        </div>
      </div>

      {report.isPending ? (
        <Loading what="Running the checks" />
      ) : report.isError ? (
        <Notice tone="fault" title="The checks could not be run">
          {report.error.message}
        </Notice>
      ) : (
        <>
          <div
            aria-label={`Findings: ${countsSentence(report.data.counts)}`}
            role="group"
            className="flex flex-wrap items-center gap-x-6 gap-y-2 rounded-lg border border-rule bg-paper-raised px-4 py-3"
          >
            {findings.length === 0 ? (
              <AllClearLabel>No findings: every rule passed</AllClearLabel>
            ) : (
              SEVERITIES.map((s) => (
                <SeverityLabel key={s} severity={s} count={report.data.counts[s]} />
              ))
            )}
          </div>

          <SafetyCautions unfused={hasUnfusedFinding(findings)} />

          {findings.length ? (
            <ul
              aria-label="Findings"
              className={`rounded-lg border border-rule bg-paper-raised ${report.isFetching ? 'opacity-70' : ''}`}
            >
              {findings.map((f) => (
                <FindingRow
                  key={f.id}
                  finding={f}
                  links={subjectLinks(f, names)}
                  hrefOf={hrefOf}
                  open={open.has(f.id)}
                  onToggle={() => toggle(f.id)}
                />
              ))}
            </ul>
          ) : null}
        </>
      )}
    </section>
  );
}
