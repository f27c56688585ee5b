/**
 * The size series a workshop picks wires from: ISO 6722 sizes in mm², or AWG gauges.
 */
import type { SizeUnit } from '../../schemas/workshop.schema.ts';
import { awgAreaMm2, formatAwgGauge, ISO_6722_SIZES_MM2, SOLD_AWG_GAUGES } from '../wire-sizes.ts';

export type WireSeries = SizeUnit;

export interface SeriesSize {
  areaMm2: number;
  /** The gauge number for an AWG size (0 = 1/0 … −3 = 4/0), null for a metric size. */
  awg: number | null;
  label: string;
}

const METRIC: readonly SeriesSize[] = ISO_6722_SIZES_MM2.map((areaMm2) => ({
  areaMm2,
  awg: null,
  label: `${areaMm2} mm²`,
}));

// Only gauges sold as automotive cable are ever suggested (SOLD_AWG_GAUGES, thinnest first).
const AWG: readonly SeriesSize[] = SOLD_AWG_GAUGES.map((gauge) => ({
  areaMm2: awgAreaMm2(gauge),
  awg: gauge,
  label: `${formatAwgGauge(gauge)} AWG`,
}));

/** The sizes of a series a shop can buy, thinnest first: what every suggestion picks from. */
export function seriesSizes(series: WireSeries): readonly SeriesSize[] {
  return series === 'awg' ? AWG : METRIC;
}
