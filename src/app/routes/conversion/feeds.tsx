import { useCallback, useMemo } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import { useOutletContext } from 'react-router-dom';
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
import { useConnectors } from '@/features/pin-map/api/get-connectors.ts';
import { usePins } from '@/features/pin-map/api/get-pins.ts';
import { pinMapKeys } from '@/features/pin-map/api/keys.ts';
import { useWorkshop } from '@/features/workshop/api/workshop.ts';

const renderLiveResults = (request: CalcRequestInput) => <LiveCalcPanel request={request} />;

/**
 * The feeds section: the feeds feature's table and form, the pin map's pins for its pickers, the
 * checks' findings on each feed, and the calculator's live answer beside the form. A save runs the
 * checks again.
 */
export function ConversionFeedsRoute() {
  const conversion = useOutletContext<Conversion>();
  const canWrite = useCan('feed:write');
  const workshop = useWorkshop();
  const pins = usePins(conversion.id);
  const connectors = useConnectors(conversion.id);
  const report = useCheckReport(conversion.id);
  const invalidateChecks = useInvalidateChecks(conversion.id);
  const queryClient = useQueryClient();
  // A feed's loads and its pins' destinations are one fact, kept by the server: read the pins again.
  const onFeedsChanged = useCallback(() => {
    void invalidateChecks();
    void queryClient.invalidateQueries({ queryKey: pinMapKeys.pins(conversion.id) });
  }, [invalidateChecks, queryClient, conversion.id]);
  const checks = useMemo<ChecksState>(
    () =>
      report.data
        ? { status: 'ready', findings: report.data.findings }
        : report.isError
          ? { status: 'error' }
          : { status: 'pending' },
    [report.data, report.isError],
  );

  if (workshop.isPending) return <Loading what="Loading the workshop settings" />;
  if (workshop.isError) {
    return (
      <Notice tone="fault" title="The workshop settings could not be loaded">
        {workshop.error.message}
      </Notice>
    );
  }

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
        pins={pins.data}
        connectors={connectors.data}
        checks={checks}
        onFeedsChanged={onFeedsChanged}
        renderLiveResults={renderLiveResults}
      />
    </div>
  );
}
