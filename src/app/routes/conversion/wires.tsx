import { useOutletContext } from 'react-router-dom';
import type { Conversion } from '#shared/schemas/conversions.schema.ts';
import { Loading } from '@/components/ui/loading.tsx';
import { Notice } from '@/components/ui/notice.tsx';
import { useCan } from '@/features/auth/hooks/use-can.ts';
import { WiresScreen } from '@/features/harness/components/wires-screen.tsx';
import { useConnectors } from '@/features/pin-map/api/get-connectors.ts';
import { usePins } from '@/features/pin-map/api/get-pins.ts';

/**
 * The wires section: the harness feature's wire list, with the pin map's pins and connectors as
 * the cavities an end can be fastened to.
 */
export function ConversionWiresRoute() {
  const conversion = useOutletContext<Conversion>();
  const canWrite = useCan('pinmap:write');
  const pins = usePins(conversion.id);
  const connectors = useConnectors(conversion.id);
  if (pins.isPending || connectors.isPending) return <Loading what="Loading the pin map" />;
  if (pins.isError || connectors.isError) {
    return (
      <Notice tone="fault" title="The pin map could not be loaded">
        {(pins.error ?? connectors.error)?.message}
      </Notice>
    );
  }
  return (
    <WiresScreen
      key={conversion.id}
      conversionId={conversion.id}
      readOnly={!canWrite}
      pins={pins.data}
      connectors={connectors.data}
    />
  );
}
