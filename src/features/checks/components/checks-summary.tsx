import { Link } from 'react-router-dom';
import { SEVERITIES } from '#shared/schemas/checks.schema.ts';
import { Button } from '@/components/ui/button.tsx';
import { AllClearLabel, SeverityLabel } from '@/components/ui/severity.tsx';
import { paths } from '@/config/paths.ts';
import { useCheckReport } from '../api/run-checks.ts';
import { countsSentence } from '../lib/findings.ts';
import { CheckedAt } from './checks-panel.tsx';

/** One line of check results for pages that change the plan, with a way to the full findings. */
export function ChecksSummary({ conversionId }: { conversionId: number }) {
  const report = useCheckReport(conversionId);
  const data = report.data;
  return (
    <section
      aria-label="Check results"
      className="flex flex-wrap items-center gap-x-5 gap-y-2 rounded-lg border border-rule bg-paper-raised px-4 py-2.5"
    >
      <span className="text-sm font-semibold text-ink">Checks</span>
      {report.isError ? (
        <span className="text-sm text-fault">Could not be run: {report.error.message}</span>
      ) : !data ? (
        <span className="text-sm text-ink-faint">Running…</span>
      ) : data.findings.length === 0 ? (
        <AllClearLabel />
      ) : (
        <span
          role="group"
          className="flex flex-wrap gap-x-4 gap-y-1"
          aria-label={countsSentence(data.counts)}
        >
          {SEVERITIES.map((s) => (
            <SeverityLabel key={s} severity={s} count={data.counts[s]} className="text-sm" />
          ))}
        </span>
      )}
      <span role="status" className="text-xs text-ink-faint">
        {report.isFetching && data ? (
          'Checking again…'
        ) : data ? (
          <>
            checked <CheckedAt iso={data.checkedAt} />
          </>
        ) : null}
      </span>
      <span className="ml-auto flex items-center gap-2">
        <Button size="sm" busy={report.isFetching} onClick={() => void report.refetch()}>
          Run checks
        </Button>
        <Link
          to={paths.conversionChecks.getHref(conversionId)}
          className="text-sm font-medium text-ink underline decoration-rule-strong underline-offset-4 hover:decoration-copper"
        >
          All findings
        </Link>
      </span>
    </section>
  );
}
