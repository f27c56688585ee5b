import { Link, useOutletContext, useParams } from 'react-router-dom';
import type { Conversion } from '#shared/schemas/conversions.schema.ts';
import { Notice } from '@/components/ui/notice.tsx';
import { paths } from '@/config/paths.ts';
import { CircuitView } from '@/features/harness/components/circuit-view.tsx';

/** "Show circuit" from a feed, a pin or a wire: the drawing of that circuit, ready to print. */
export function ConversionCircuitRoute() {
  const conversion = useOutletContext<Conversion>();
  const { kind, refId } = useParams();
  const id = Number(refId);
  if ((kind !== 'feed' && kind !== 'pin') || !Number.isInteger(id) || id <= 0) {
    return <Notice tone="fault" title="No such circuit" />;
  }
  return (
    <div className="grid gap-3">
      <nav aria-label="Back" className="flex gap-4 text-sm print:hidden">
        <Link
          className="text-copper-deep hover:underline"
          to={paths.conversionWires.getHref(conversion.id)}
        >
          ← Wires
        </Link>
        <Link
          className="text-copper-deep hover:underline"
          to={
            kind === 'feed'
              ? paths.conversionFeeds.getHref(conversion.id)
              : paths.conversionPins.getHref(conversion.id)
          }
        >
          ← {kind === 'feed' ? 'Feeds' : 'Pin map'}
        </Link>
      </nav>
      <CircuitView key={`${kind}-${id}`} conversionId={conversion.id} kind={kind} refId={id} />
    </div>
  );
}
