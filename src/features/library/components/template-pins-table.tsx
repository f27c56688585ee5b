import { showField } from '#shared/domain/fields/field-table.ts';
import { PIN_FIELDS, TEMPLATE_PIN_FIELDS } from '#shared/domain/fields/pin-fields.ts';
import type { TemplatePin } from '#shared/schemas/library.schema.ts';
import { DispositionLabel } from '@/components/ui/disposition-glyph.tsx';
import { WireColour } from '@/components/ui/wire-colour.tsx';

const faint = <span className="text-ink-faint">—</span>;

/** One field of a template pin: colours as swatches, dispositions with their glyph, else as text. */
function FieldCell({
  pin,
  field,
}: {
  pin: TemplatePin;
  field: (typeof TEMPLATE_PIN_FIELDS)[number];
}) {
  if (field === 'colour') return <WireColour value={pin.colour} />;
  if (field === 'disposition') return <DispositionLabel disposition={pin.disposition} />;
  return showField(PIN_FIELDS, field, pin[field], 'mm2') || faint;
}

/** A template's cavities in face order with what each carries. */
export function TemplatePinsTable({ pins, caption }: { pins: TemplatePin[]; caption: string }) {
  return (
    <div className="overflow-x-auto rounded-lg border border-rule bg-paper-raised">
      <table className="lw-table w-full border-collapse text-sm">
        <caption className="sr-only">{caption}</caption>
        <thead className="border-b border-rule bg-paper-sunk/60">
          <tr>
            <th scope="col" className="px-3 py-2">
              Cavity
            </th>
            {TEMPLATE_PIN_FIELDS.map((field) => (
              <th key={field} scope="col" className="px-3 py-2">
                {PIN_FIELDS[field].label}
              </th>
            ))}
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
              {TEMPLATE_PIN_FIELDS.map((field) => (
                <td
                  key={field}
                  className={
                    field === 'notes' ? 'max-w-[24rem] px-3 py-2 text-ink-soft' : 'px-3 py-2'
                  }
                >
                  <FieldCell pin={pin} field={field} />
                </td>
              ))}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
