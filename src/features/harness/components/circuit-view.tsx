import { Button } from '@/components/ui/button.tsx';
import { Loading } from '@/components/ui/loading.tsx';
import { Notice } from '@/components/ui/notice.tsx';
import { circuitSvgUrl, useCircuit, type CircuitKind } from '../api/get-circuit.ts';

/**
 * One circuit's drawing as the server draws it (source, fuse, relay contacts, wires, splices,
 * pins, loads and ground), with the words it names listed beneath for reading and searching.
 */
export function CircuitView({
  conversionId,
  kind,
  refId,
}: {
  conversionId: number;
  kind: CircuitKind;
  refId: number;
}) {
  const circuit = useCircuit(conversionId, kind, refId);
  // The version in the address makes a fresh drawing after the harness changes.
  const src = `${circuitSvgUrl(conversionId, kind, refId)}?at=${circuit.dataUpdatedAt}`;
  if (circuit.isPending) return <Loading what="Drawing the circuit" />;
  if (circuit.isError) {
    return (
      <Notice tone="fault" title="The circuit could not be drawn">
        {circuit.error.message}
      </Notice>
    );
  }
  const { title, labels } = circuit.data;
  return (
    <section aria-label="Circuit" className="grid gap-4">
      <div className="flex flex-wrap items-center gap-2 print:hidden">
        <h2 className="mr-auto text-lg font-semibold">{title}</h2>
        <Button size="sm" onClick={() => window.print()}>
          Print
        </Button>
        <a
          href={src}
          target="_blank"
          rel="noreferrer"
          className="rounded-md border border-rule-strong px-2.5 py-1 text-sm font-medium hover:bg-paper-sunk"
        >
          Open the SVG
        </a>
      </div>
      <div className="overflow-x-auto rounded-lg border border-rule bg-white p-2">
        <img src={src} alt={`${title}: ${labels.join(', ')}`} className="h-auto max-w-full" />
      </div>
      <div className="print:hidden">
        <h3 className="mb-1 text-sm font-semibold text-ink-soft">Named in the drawing</h3>
        <ul aria-label="Named in the drawing" className="flex flex-wrap gap-1.5 text-sm">
          {labels.map((l) => (
            <li key={l} className="rounded border border-rule bg-paper-raised px-1.5 font-mono">
              {l}
            </li>
          ))}
        </ul>
      </div>
    </section>
  );
}
