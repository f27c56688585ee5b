import { SIGNAL_CLASS_LABELS } from '#shared/domain/signal-classes.ts';
import { formatWireSize } from '#shared/domain/wire-sizes.ts';
import type { TemplatePin } from '#shared/schemas/library.schema.ts';
import { DispositionLabel } from '@/components/ui/disposition-glyph.tsx';
import { WireColour } from '@/components/ui/wire-colour.tsx';

/** A template's cavities in face order with what each carries. */
export function TemplatePinsTable({ pins, caption }: { pins: TemplatePin[]; caption: string }) {
  return (
    <div className="overflow-x-auto rounded-lg border border-rule bg-paper-raised">
      <table className="lw-table w-full border-collapse text-sm">
        <caption className="sr-only">{caption}</caption>
        <thead className="border-b border-rule bg-paper-sunk/60">
          <tr>
            {['Cavity', 'Function', 'Signal class', 'Colour', 'Size', 'Disposition', 'Notes'].map(
              (h) => (
                <th key={h} scope="col" className="px-3 py-2">
                  {h}
                </th>
              ),
            )}
          </tr>
        </thead>
        <tbody>
          {pins.map((pin) => (
            <tr key={pin.cavity} className="border-b border-rule/70 last:border-0">
              <th
                scope="row"
                className="px-3 py-2 text-left font-mono text-[0.8125rem] font-semibold"
              >
                {pin.cavity}
              </th>
              <td className="px-3 py-2">
                {pin.function || <span className="text-ink-faint">—</span>}
              </td>
              <td className="px-3 py-2 text-ink-soft">
                {pin.signalClass === 'none' ? '—' : SIGNAL_CLASS_LABELS[pin.signalClass]}
              </td>
              <td className="px-3 py-2">
                <WireColour value={pin.colour} />
              </td>
              <td className="px-3 py-2 whitespace-nowrap">
                {pin.sizeMm2 == null ? (
                  <span className="text-ink-faint">—</span>
                ) : (
                  formatWireSize(pin.sizeMm2, 'mm2')
                )}
              </td>
              <td className="px-3 py-2">
                <DispositionLabel disposition={pin.disposition} />
              </td>
              <td className="max-w-[24rem] px-3 py-2 text-ink-soft">{pin.notes}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
