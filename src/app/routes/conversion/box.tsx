import { useMemo } from 'react';
import { useOutletContext } from 'react-router-dom';
import type { Conversion } from '#shared/schemas/conversions.schema.ts';
import { useCan } from '@/features/auth/hooks/use-can.ts';
import { useFeeds } from '@/features/feeds/api/get-feeds.ts';
import { BoxScreen } from '@/features/harness/components/box-screen.tsx';
import { WithPinMap } from './with-pin-map.tsx';

/**
 * The box section: the harness feature's box drawing, with the pin map's cavities for the far
 * ends of the wires and the feeds' names for the positions that serve them.
 */
export function ConversionBoxRoute() {
  const conversion = useOutletContext<Conversion>();
  const canWrite = useCan('pinmap:write');
  const feeds = useFeeds(conversion.id);
  const feedNames = useMemo(
    () => new Map((feeds.data ?? []).map((f) => [f.id, f.name])),
    [feeds.data],
  );
  return (
    <WithPinMap conversionId={conversion.id}>
      {({ pins, connectors }) => (
        <BoxScreen
          key={conversion.id}
          conversionId={conversion.id}
          readOnly={!canWrite}
          pins={pins}
          connectors={connectors}
          feedNames={feedNames}
        />
      )}
    </WithPinMap>
  );
}
