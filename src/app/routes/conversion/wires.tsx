import { useOutletContext } from 'react-router-dom';
import type { Conversion } from '#shared/schemas/conversions.schema.ts';
import { useCan } from '@/features/auth/hooks/use-can.ts';
import { WiresScreen } from '@/features/harness/components/wires-screen.tsx';
import { WithPinMap } from './with-pin-map.tsx';

/**
 * The wires section: the harness feature's wire list, with the pin map's pins and connectors as
 * the cavities an end can be fastened to.
 */
export function ConversionWiresRoute() {
  const conversion = useOutletContext<Conversion>();
  const canWrite = useCan('pinmap:write');
  return (
    <WithPinMap conversionId={conversion.id}>
      {({ pins, connectors }) => (
        <WiresScreen
          key={conversion.id}
          conversionId={conversion.id}
          readOnly={!canWrite}
          pins={pins}
          connectors={connectors}
        />
      )}
    </WithPinMap>
  );
}
