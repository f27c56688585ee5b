/**
 * Sizes in findings are kept as numbers and written out only when a finding is shown, in the unit
 * of whoever shows it: a revision frozen in one unit prints in the workshop's unit of today, like
 * every other size on the same worksheet.
 */
import type { Finding } from '../../schemas/checks.schema.ts';
import type { SizeUnit } from '../../schemas/workshop.schema.ts';
import { formatWireSize } from '../wire-sizes.ts';

// ⟦ and ⟧ (U+27E6, U+27E7) never appear in what the checks write around them.
const SIZE_MARK = /⟦size:([^⟧]+)⟧/g;

/** A size as a finding stores it: the area in mm², marked for `showSizes`. */
export const sizeMark = (areaMm2: number) => `⟦size:${areaMm2}⟧`;

/** Text with every marked size written in `unit` ("0.75 mm²", "18 AWG"). */
export function showSizes(text: string, unit: SizeUnit): string {
  return text.replace(SIZE_MARK, (mark, area: string) => {
    const areaMm2 = Number(area);
    return Number.isFinite(areaMm2) ? formatWireSize(areaMm2, unit) : mark;
  });
}

/** A finding as shown: every marked size in its text, working and values written in `unit`. */
export function showFinding(f: Finding, unit: SizeUnit): Finding {
  return {
    ...f,
    title: showSizes(f.title, unit),
    message: showSizes(f.message, unit),
    working: f.working.map((line) => showSizes(line, unit)),
    values: Object.fromEntries(
      Object.entries(f.values).map(([key, v]) => [
        key,
        typeof v.value === 'string' ? { ...v, value: showSizes(v.value, unit) } : v,
      ]),
    ),
  };
}
