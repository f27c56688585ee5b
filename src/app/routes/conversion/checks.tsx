import { useOutletContext } from 'react-router';
import type { Conversion } from '#shared/schemas/conversions.schema.ts';
import { ChecksPanel } from '@/features/checks/components/checks-panel.tsx';

/** The checks section: every finding on the conversion, each linked to its pins or feed. */
export function ConversionChecksRoute() {
  const conversion = useOutletContext<Conversion>();
  return <ChecksPanel key={conversion.id} conversionId={conversion.id} />;
}
