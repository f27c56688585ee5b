import { useCallback } from 'react';
import { useOutletContext } from 'react-router';
import type { CalcRequestInput } from '#shared/schemas/calc.schema.ts';
import type { Conversion } from '#shared/schemas/conversions.schema.ts';
import { Loading } from '@/components/ui/loading.tsx';
import { Notice } from '@/components/ui/notice.tsx';
import { useCan } from '@/features/auth/hooks/use-can.ts';
import { LiveCalcPanel } from '@/features/calculator/components/live-calc-panel.tsx';
import { useCheckReport, useInvalidateChecks } from '@/features/checks/api/run-checks.ts';
import { ChecksSummary } from '@/features/checks/components/checks-summary.tsx';
import type { ChecksState } from '@/features/feeds/components/feeds-table.tsx';
import { FeedsScreen } from '@/features/feeds/components/feeds-screen.tsx';
import { useWorkshop } from '@/features/workshop/api/workshop.ts';

const renderLiveResults = (request: CalcRequestInput) => <LiveCalcPanel request={request} />;

/**
 * The feeds section: the feeds feature's table and form, the checks' findings on each feed, and the
 * calculator's live answer beside the form. A save runs the checks again.
 */
export function ConversionFeedsRoute() {
  const conversion = useOutletContext<Conversion>();
  const canWrite = useCan('feed:write');
  const workshop = useWorkshop();
  const report = useCheckReport(conversion.id);
  const invalidateChecks = useInvalidateChecks(conversion.id);
  const onFeedsChanged = useCallback(() => void invalidateChecks(), [invalidateChecks]);

  if (workshop.isPending) return <Loading what="Loading the workshop settings" />;
  if (workshop.isError) {
    return (
      <Notice tone="fault" title="The workshop settings could not be loaded">
        {workshop.error.message}
      </Notice>
    );
  }
  const checks: ChecksState = report.data
    ? { status: 'ready', findings: report.data.findings }
    : report.isError
      ? { status: 'error' }
      : { status: 'pending' };

  return (
    <div className="grid gap-5">
      <ChecksSummary conversionId={conversion.id} />
      <FeedsScreen
        key={conversion.id}
        conversionId={conversion.id}
        systemV={conversion.systemVoltage}
        sizeUnit={workshop.data.sizeUnit}
        defaultInsulationC={workshop.data.defaultInsulationC}
        readOnly={!canWrite}
        checks={checks}
        onFeedsChanged={onFeedsChanged}
        renderLiveResults={renderLiveResults}
      />
    </div>
  );
}
