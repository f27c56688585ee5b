import { useOutletContext } from 'react-router';
import type { Conversion } from '#shared/schemas/conversions.schema.ts';

export function ConversionFeedsRoute() {
  const c = useOutletContext<Conversion>();
  return <p className="text-ink-soft">{c.name}: this section is being built.</p>;
}
