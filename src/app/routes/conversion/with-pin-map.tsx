import type { ReactNode } from 'react';
import type { Connector, Pin } from '#shared/schemas/pin-map.schema.ts';
import { Loading } from '@/components/ui/loading.tsx';
import { Notice } from '@/components/ui/notice.tsx';
import { useConnectors } from '@/features/pin-map/api/get-connectors.ts';
import { usePins } from '@/features/pin-map/api/get-pins.ts';

/** Loads a conversion's pins and connectors, then renders `children` with them (or says why not). */
export function WithPinMap({
  conversionId,
  children,
}: {
  conversionId: number;
  children: (plan: { pins: Pin[]; connectors: Connector[] }) => ReactNode;
}) {
  const pins = usePins(conversionId);
  const connectors = useConnectors(conversionId);
  if (pins.isPending || connectors.isPending) return <Loading what="Loading the pin map" />;
  if (pins.isError || connectors.isError) {
    return (
      <Notice tone="fault" title="The pin map could not be loaded">
        {(pins.error ?? connectors.error)?.message}
      </Notice>
    );
  }
  return children({ pins: pins.data, connectors: connectors.data });
}
