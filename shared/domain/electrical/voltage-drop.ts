/**
 * Voltage drop of a run and the smallest size that keeps it within a limit.
 */
import { conductorResistance, type AwgAreaBasis, type ResistanceModel } from './copper.ts';
import { FLOAT_SLACK, requirePositive } from './guards.ts';
import type { SourceId } from './sources.ts';
import { seriesSizes, type SeriesSize, type WireSeries } from './wire-series.ts';

export type ReturnPath = 'wire' | 'chassis';

/** ABYC E-11: 3 % where drop must be kept to a minimum (ECU feeds, sensors), 10 % elsewhere. */
export const DROP_LIMIT_PCT = { critical: 3, general: 10 } as const;

/**
 * Length of conductor the current flows through: out and back on a two-wire circuit, the supply
 * wire only on a chassis return (common practice, no source; the body's own resistance is not counted).
 */
export function conductorLengthM(runLengthM: number, returnPath: ReturnPath): number {
  requirePositive('runLengthM', runLengthM);
  return returnPath === 'wire' ? 2 * runLengthM : runLengthM;
}

export interface VoltageDropInput {
  currentA: number;
  /** One-way run length, m. */
  runLengthM: number;
  areaMm2: number;
  returnPath: ReturnPath;
  conductorTempC?: number;
  systemV: number;
  resistivityOhmMm2PerM?: number;
  model?: ResistanceModel;
  awgAreaBasis?: AwgAreaBasis;
}

export interface VoltageDrop {
  conductorLengthM: number;
  resistanceOhm: number;
  voltageDropV: number;
  voltageDropPct: number;
  notes: string[];
  sources: SourceId[];
}

/** ΔV = I·R over the conductor length; as a percentage of the system voltage. */
export function voltageDrop(input: VoltageDropInput): VoltageDrop {
  const { currentA, runLengthM, areaMm2, returnPath, conductorTempC = 20, systemV } = input;
  requirePositive('currentA', currentA);
  requirePositive('systemV', systemV);
  const lengthM = conductorLengthM(runLengthM, returnPath);
  const resistance = conductorResistance({
    areaMm2,
    lengthM,
    conductorTempC,
    resistivityOhmMm2PerM: input.resistivityOhmMm2PerM,
    model: input.model,
    awgAreaBasis: input.awgAreaBasis,
  });
  const voltageDropV = currentA * resistance.resistanceOhm;
  const lengthNote =
    returnPath === 'wire'
      ? `Two-wire circuit: conductor length 2 × ${runLengthM} m = ${lengthM} m.`
      : `Chassis return: the supply wire only, ${lengthM} m; the body's resistance is not counted.`;
  return {
    conductorLengthM: lengthM,
    resistanceOhm: resistance.resistanceOhm,
    voltageDropV,
    voltageDropPct: (voltageDropV / systemV) * 100,
    notes: [lengthNote, ...resistance.notes],
    sources: ['common-practice', ...resistance.sources],
  };
}

export interface MinSizeForDropInput {
  currentA: number;
  runLengthM: number;
  returnPath: ReturnPath;
  conductorTempC?: number;
  systemV: number;
  dropLimitPct: number;
  series: WireSeries;
  resistivityOhmMm2PerM?: number;
  model?: ResistanceModel;
  awgAreaBasis?: AwgAreaBasis;
  /** The conductor temperature of each size tried (a thinner wire runs hotter); else conductorTempC. */
  conductorTempFor?: (areaMm2: number) => number;
}

export interface SizeForDrop extends SeriesSize {
  /** The drop at this size, %. */
  voltageDropPct: number;
  sources: SourceId[];
}

/** The thinnest size of the series whose drop is within the limit; null if even the thickest fails. */
export function minSizeForDrop(input: MinSizeForDropInput): SizeForDrop | null {
  const { dropLimitPct, series, conductorTempFor, ...run } = input;
  requirePositive('dropLimitPct', dropLimitPct);
  for (const size of seriesSizes(series)) {
    const conductorTempC = conductorTempFor ? conductorTempFor(size.areaMm2) : run.conductorTempC;
    const drop = voltageDrop({ ...run, conductorTempC, areaMm2: size.areaMm2 });
    if (drop.voltageDropPct <= dropLimitPct * (1 + FLOAT_SLACK)) {
      return { ...size, voltageDropPct: drop.voltageDropPct, sources: drop.sources };
    }
  }
  return null;
}
