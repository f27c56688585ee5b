import type { PinChoice } from '../lib/feed-display.ts';

/** Pins as <option>s grouped by connector: "E2-9 Fuel pump relay coil control". */
export function PinOptions({ pins }: { pins: PinChoice[] }) {
  const groups = new Map<string, PinChoice[]>();
  for (const p of pins) {
    const list = groups.get(p.connectorLabel) ?? [];
    list.push(p);
    groups.set(p.connectorLabel, list);
  }
  return (
    <>
      {[...groups].map(([label, list]) => (
        <optgroup key={label} label={`Connector ${label}`}>
          {list.map((p) => (
            <option key={p.id} value={String(p.id)}>
              {p.label}
            </option>
          ))}
        </optgroup>
      ))}
    </>
  );
}
