/**
 * Conductor sizes. Sizes are stored in mm² (cross-sectional area) and shown in the workshop's unit:
 * mm² from the ISO 6722 series, or AWG by the ASTM B258 formula.
 */
import type { SizeUnit } from '../schemas/workshop.schema.ts';

/**
 * Nominal cross-sections of ISO 6722-1 road-vehicle cables, mm², as listed by cable makers'
 * datasheets that state ISO 6722 compliance (the standard's own table was not read).
 */
export const ISO_6722_SIZES_MM2 = [
  0.22, 0.35, 0.5, 0.75, 1, 1.5, 2, 2.5, 3, 4, 6, 10, 16, 25, 35, 50, 70,
] as const;

/** AWG gauges handled, thickest first; 0, -1, -2, -3 stand for 1/0, 2/0, 3/0, 4/0. */
export const AWG_GAUGES = [
  -3, -2, -1, 0, 1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11, 12, 13, 14, 15, 16, 17, 18, 19, 20, 21, 22, 23,
  24, 25, 26, 27, 28, 29, 30,
] as const;
export const AWG_MIN = -3;

/**
 * The AWG sizes automotive cable is sold in, thinnest first: even gauges 22 … 2, then 1, 1/0, 2/0,
 * 3/0 and 4/0 (common practice, no source). Suggestions only ever name these; odd gauges can still
 * be recorded for a wire that is already there.
 */
export const SOLD_AWG_GAUGES = [22, 20, 18, 16, 14, 12, 10, 8, 6, 4, 2, 1, 0, -1, -2, -3] as const;
export const AWG_MAX = 30;

/** ASTM B258: d = 0.127 mm × 92^((36 − n)/39). */
export function awgDiameterMm(gauge: number): number {
  return 0.127 * 92 ** ((36 - gauge) / 39);
}

/** Cross-section of a solid round conductor of that gauge, mm². */
export function awgAreaMm2(gauge: number): number {
  const d = awgDiameterMm(gauge);
  return (Math.PI / 4) * d * d;
}

/** The area stored for an AWG size: rounded to 0.0001 mm², as size editors and imports write it. */
export function storedAwgAreaMm2(gauge: number): number {
  return Number(awgAreaMm2(gauge).toFixed(4));
}

export function isAwgGauge(gauge: number): boolean {
  return Number.isInteger(gauge) && gauge >= AWG_MIN && gauge <= AWG_MAX;
}

/** "4/0" for −3, "0" → "1/0", "18" → "18". */
export function formatAwgGauge(gauge: number): string {
  return gauge <= 0 ? `${1 - gauge}/0` : String(gauge);
}

/** Reads "18", "4/0", "0000" into a gauge number, or null. */
export function parseAwgGauge(text: string): number | null {
  const t = text
    .trim()
    .toUpperCase()
    .replace(/\s*AWG$/, '')
    .trim();
  const slash = /^([1-4])\/0$/.exec(t);
  if (slash) return 1 - Number(slash[1]);
  if (/^0{1,4}$/.test(t)) return 1 - t.length;
  if (!/^\d{1,2}$/.test(t)) return null;
  const gauge = Number(t);
  return isAwgGauge(gauge) ? gauge : null;
}

/** The gauge whose area is nearest to `areaMm2` (by ratio, as gauges step geometrically). */
export function nearestAwg(areaMm2: number): number {
  let best: number = AWG_GAUGES[0];
  let bestDistance = Infinity;
  for (const gauge of AWG_GAUGES) {
    const distance = Math.abs(Math.log(awgAreaMm2(gauge) / areaMm2));
    if (distance < bestDistance) {
      best = gauge;
      bestDistance = distance;
    }
  }
  return best;
}

/** Within 1 % counts as the same size: stored AWG areas round-trip through mm². */
const SAME_SIZE = 0.01;
export const sameSize = (a: number, b: number) => Math.abs(a - b) / b <= SAME_SIZE;

/** The AWG gauge this area is exactly (within 1 %), or null. */
export function exactAwg(areaMm2: number): number | null {
  const gauge = nearestAwg(areaMm2);
  return sameSize(areaMm2, awgAreaMm2(gauge)) ? gauge : null;
}

/** The ISO 6722 size this area is (within 1 %), or null. */
export function exactIsoSize(areaMm2: number): number | null {
  return ISO_6722_SIZES_MM2.find((s) => sameSize(areaMm2, s)) ?? null;
}

/**
 * The one set of sizes Loomwright accepts, mm², thinnest first: the ISO 6722 series and the stored
 * area of every AWG gauge. The two series never fall within 1 % of each other, so each accepted
 * size belongs to exactly one of them.
 */
export const WIRE_SIZES_MM2: readonly number[] = [
  ...ISO_6722_SIZES_MM2,
  ...AWG_GAUGES.map(storedAwgAreaMm2),
].sort((a, b) => a - b);

/** The accepted size this area is (within 1 %, as typed or as an older import stored it), or null. */
export function acceptedWireSize(areaMm2: number): number | null {
  const iso = exactIsoSize(areaMm2);
  if (iso !== null) return iso;
  const gauge = exactAwg(areaMm2);
  return gauge === null ? null : storedAwgAreaMm2(gauge);
}

function trimNumber(n: number): string {
  return String(Number(n.toFixed(n < 1 ? 3 : 2)));
}

/**
 * A stored size as the workshop reads it, always exactly: "0.75 mm²", "18 AWG". A metric size in
 * an AWG workshop keeps its own label ("1 mm²"), never a nearest "≈" gauge that no one sells; an
 * AWG size in a metric workshop shows its area ("0.823 mm²").
 */
export function formatWireSize(areaMm2: number | null | undefined, unit: SizeUnit): string {
  if (areaMm2 == null) return '';
  const gauge = exactAwg(areaMm2);
  const iso = exactIsoSize(areaMm2);
  if (unit === 'awg') {
    if (gauge !== null) return `${formatAwgGauge(gauge)} AWG`;
    return `${trimNumber(iso ?? areaMm2)} mm²`;
  }
  return `${trimNumber(iso ?? areaMm2)} mm²`;
}

/**
 * The value to put in an editor, which `parseWireSize` reads back to the same size: "0.75" in mm²,
 * "18" in AWG, and a size of the other series with its unit spelled out ("4 mm²" in an AWG
 * workshop, "18 AWG" in a metric one), so saving it unchanged never moves the wire to the nearest
 * size of the workshop's series.
 */
export function editableWireSize(areaMm2: number | null | undefined, unit: SizeUnit): string {
  if (areaMm2 == null) return '';
  const gauge = exactAwg(areaMm2);
  const iso = exactIsoSize(areaMm2);
  if (unit === 'awg') {
    if (gauge !== null) return formatAwgGauge(gauge);
    return `${trimNumber(iso ?? areaMm2)} mm²`;
  }
  if (iso !== null) return trimNumber(iso);
  if (gauge !== null) return `${formatAwgGauge(gauge)} AWG`;
  return trimNumber(areaMm2);
}

export type SizeParse = { ok: true; areaMm2: number | null } | { ok: false; error: string };

/**
 * Reads a size typed in the workshop's unit (or with an explicit "mm²"/"mm2"/"AWG" suffix) into mm².
 * Metric sizes must be in the ISO 6722 series; AWG sizes 4/0 to 30. Empty means "not recorded".
 */
export function parseWireSize(input: string, unit: SizeUnit): SizeParse {
  const text = input.trim().replace(',', '.');
  if (!text) return { ok: true, areaMm2: null };
  const awgSuffix = /awg$/i.test(text);
  const mmSuffix = /mm(²|2|\^2)?$/i.test(text);
  const asUnit: SizeUnit = awgSuffix ? 'awg' : mmSuffix ? 'mm2' : unit;
  const bare = text.replace(/\s*(awg|mm(²|2|\^2)?)$/i, '');
  if (asUnit === 'awg') {
    const gauge = parseAwgGauge(bare);
    if (gauge === null)
      return { ok: false, error: `"${input}" is not an AWG size between 4/0 and 30` };
    return { ok: true, areaMm2: storedAwgAreaMm2(gauge) };
  }
  const area = Number(bare);
  if (!Number.isFinite(area) || area <= 0)
    return { ok: false, error: `"${input}" is not a wire size in mm²` };
  const iso = exactIsoSize(area);
  if (iso === null) {
    return {
      ok: false,
      error: `${area} mm² is not an ISO 6722 size (${ISO_6722_SIZES_MM2.join(', ')})`,
    };
  }
  return { ok: true, areaMm2: iso };
}
