import { useQuery } from '@tanstack/react-query';
import { useOutletContext } from 'react-router-dom';
import type { Conversion } from '#shared/schemas/conversions.schema.ts';
import { useCheckReport } from '@/features/checks/api/run-checks.ts';
import { ChecksPanel } from '@/features/checks/components/checks-panel.tsx';
import { getFeedsQueryOptions } from '@/features/feeds/api/get-feeds.ts';
import { getConnectorsQueryOptions } from '@/features/pin-map/api/get-connectors.ts';
import { getPinsQueryOptions } from '@/features/pin-map/api/get-pins.ts';

/**
 * The checks section: every finding on the conversion, each linked to its pins or feed, named from
 * the pin map and the feeds (read only when some finding links to them).
 */
export function ConversionChecksRoute() {
  const conversion = useOutletContext<Conversion>();
  const findings = useCheckReport(conversion.id).data?.findings ?? [];
  const needPins = findings.some((f) => f.subject.pinIds?.length);
  const needFeeds = findings.some((f) => f.subject.feedId != null);
  const pins = useQuery({ ...getPinsQueryOptions(conversion.id), enabled: needPins });
  const connectors = useQuery({ ...getConnectorsQueryOptions(conversion.id), enabled: needPins });
  const feeds = useQuery({ ...getFeedsQueryOptions(conversion.id), enabled: needFeeds });
  return (
    <ChecksPanel
      key={conversion.id}
      conversionId={conversion.id}
      pins={pins.data}
      connectors={connectors.data}
      feeds={feeds.data}
    />
  );
}
