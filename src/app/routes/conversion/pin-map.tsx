import { useOutletContext } from 'react-router';
import type { Conversion } from '#shared/schemas/conversions.schema.ts';

export function ConversionPinMapRoute() {
  const c = useOutletContext<Conversion>();
  return <p className="text-ink-soft">The pin map of {c.name}.</p>;
}
