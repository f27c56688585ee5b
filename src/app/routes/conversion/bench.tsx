import { Link, useOutletContext, useSearchParams } from 'react-router-dom';
import type { Conversion } from '#shared/schemas/conversions.schema.ts';
import { Loading } from '@/components/ui/loading.tsx';
import { Notice } from '@/components/ui/notice.tsx';
import { paths } from '@/config/paths.ts';
import { useCan } from '@/features/auth/hooks/use-can.ts';
import { useBenchSheet } from '@/features/bench/api/bench.ts';
import { useTestPlan } from '@/features/bench/api/test-plan.ts';
import { BenchChecklist } from '@/features/bench/components/bench-checklist.tsx';
import { BenchQueueStatus } from '@/features/bench/components/bench-queue-status.tsx';
import { TestPlanView } from '@/features/bench/components/test-plan.tsx';
import { revisionWorksheetHref } from '@/features/revisions/api/revisions.ts';
import { useWorkshop } from '@/features/workshop/api/workshop.ts';
import { formatDate } from '@/lib/format-date.ts';

export function ConversionBenchRoute() {
  const conversion = useOutletContext<Conversion>();
  const sheet = useBenchSheet(conversion.id);
  const workshop = useWorkshop();
  const canRecord = useCan('bench:record');
  const [search, setSearch] = useSearchParams();
  const view = search.get('view') === 'test-plan' ? 'test-plan' : 'checklist';

  if (sheet.isPending) return <Loading what="Loading the bench checklist" />;
  if (sheet.isError) {
    return (
      <Notice tone="fault" title="The bench checklist could not be loaded">
        {sheet.error.message}
      </Notice>
    );
  }
  if (!sheet.data.revision) {
    return (
      <Notice tone="caution" title="Nothing signed off yet">
        The bench works only from a signed-off revision.{' '}
        <Link className="underline" to={paths.conversionRevisions.getHref(conversion.id)}>
          See the revisions
        </Link>
        .
      </Notice>
    );
  }
  const r = sheet.data.revision;
  return (
    <div className="flex flex-col gap-4">
      <div className="flex flex-wrap items-start justify-between gap-4">
        <div>
          <h2 className="text-xl font-semibold">Bench checklist, revision {r.number}</h2>
          <p className="text-sm text-ink-soft">
            Signed off by {r.reviewedBy} on {formatDate(r.signedAt, 'date')} · hash{' '}
            <span className="font-mono">{r.hash.slice(0, 12)}</span>
          </p>
        </div>
        <a
          className="flex min-h-11 items-center rounded-md border border-rule-strong bg-paper-raised px-4 font-medium hover:bg-paper-sunk"
          href={revisionWorksheetHref(conversion.id, r.number)}
          target="_blank"
          rel="noopener"
        >
          Print bench worksheet
        </a>
      </div>
      <Notice tone="caution" title="Before you start">
        Disconnect the battery. Relieve fuel pressure before opening the fuel system. Airbag
        circuits stay live after disconnection: leave them to the maker&apos;s procedure. Never
        probe an ECU pin with a test lamp or put 12 V on one; unplug the ECU before an insulation
        test. Test every circuit before first power-up, ideally from a current-limited supply. Local
        codes and licensed practice prevail.
      </Notice>
      <div className="flex flex-wrap items-center justify-between gap-3">
        <div role="tablist" aria-label="Bench" className="flex gap-1">
          {(
            [
              ['checklist', 'Checklist'],
              ['test-plan', 'Test plan'],
            ] as const
          ).map(([v, label]) => (
            <button
              key={v}
              type="button"
              role="tab"
              aria-selected={view === v}
              onClick={() => setSearch(v === 'checklist' ? {} : { view: v }, { replace: true })}
              className={`min-h-11 rounded-md border px-5 font-semibold ${view === v ? 'border-ink bg-ink text-paper' : 'border-rule-strong bg-paper-raised'}`}
            >
              {label}
            </button>
          ))}
        </div>
        <div className="flex flex-wrap items-center gap-3">
          <BenchQueueStatus conversionId={conversion.id} />
        </div>
      </div>
      {view === 'checklist' ? (
        <BenchChecklist
          conversionId={conversion.id}
          sheet={sheet.data}
          unit={workshop.data?.sizeUnit ?? 'mm2'}
          canRecord={canRecord}
        />
      ) : (
        <BenchTestPlan conversionId={conversion.id} number={r.number} canRecord={canRecord} />
      )}
    </div>
  );
}

function BenchTestPlan({
  conversionId,
  number,
  canRecord,
}: {
  conversionId: number;
  number: number;
  canRecord: boolean;
}) {
  const plan = useTestPlan(conversionId, number);
  if (plan.isPending) return <Loading what="Loading the test plan" />;
  if (plan.isError) {
    return (
      <Notice tone="fault" title="The test plan could not be loaded">
        {plan.error.message}
      </Notice>
    );
  }
  return <TestPlanView conversionId={conversionId} data={plan.data} canRecord={canRecord} />;
}
