import { useMemo } from 'react';
import { useOutletContext } from 'react-router-dom';
import type { Conversion } from '#shared/schemas/conversions.schema.ts';
import { Loading } from '@/components/ui/loading.tsx';
import { Notice } from '@/components/ui/notice.tsx';
import { useCan } from '@/features/auth/hooks/use-can.ts';
import { useFeeds } from '@/features/feeds/api/get-feeds.ts';
import { BoxScreen } from '@/features/harness/components/box-screen.tsx';
import { useConnectors } from '@/features/pin-map/api/get-connectors.ts';
import { usePins } from '@/features/pin-map/api/get-pins.ts';

/**
 * The box section: the harness feature's box drawing, with the pin map's cavities for the far
 * ends of the wires and the feeds' names for the positions that serve them.
 */
export function ConversionBoxRoute() {
  const conversion = useOutletContext<Conversion>();
  const canWrite = useCan('pinmap:write');
  const pins = usePins(conversion.id);
  const connectors = useConnectors(conversion.id);
  const feeds = useFeeds(conversion.id);
  const feedNames = useMemo(
    () => new Map((feeds.data ?? []).map((f) => [f.id, f.name])),
    [feeds.data],
  );
  if (pins.isPending || connectors.isPending) return <Loading what="Loading the pin map" />;
  if (pins.isError || connectors.isError) {
    return (
      <Notice tone="fault" title="The pin map could not be loaded">
        {(pins.error ?? connectors.error)?.message}
      </Notice>
    );
  }
  return (
    <BoxScreen
      key={conversion.id}
      conversionId={conversion.id}
      readOnly={!canWrite}
      pins={pins.data}
      connectors={connectors.data}
      feedNames={feedNames}
    />
  );
}
