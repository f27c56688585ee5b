/**
 * How hot a loaded conductor runs. The checks and the calculator both start from the ambient that
 * Table 5 assumes and add the rise the load causes, so the same feed gives the same drop in both.
 */
import { requireFinite, requireNonNegative, requirePositive } from './guards.ts';
import type { Zone } from './ampacity.ts';

/**
 * Ambient around the wire, °C: 30 °C outside engine spaces and 50 °C inside, the conditions 33 CFR
 * 183.425 Table 5 and its note 1 are written for. One set of defaults for checks and calculator.
 */
export const AMBIENT_C: Readonly<Record<Zone, number>> = { cabin: 30, engine_bay: 50 };

export interface ConductorTemperatureInput {
  ambientC: number;
  insulationRatingC: number;
  currentA: number;
  /** The allowable current at that rating and ambient (the derated ampacity), A. */
  ampacityA: number;
}

export interface ConductorTemperature {
  conductorTempC: number;
  /** The working line, for a finding or the calculator. */
  working: string;
}

/**
 * FAA AC 43.13-1B ¶11-66: T = T_amb + (T_rating − T_amb)·(I / I_max)². At the allowable current the
 * conductor reaches its insulation rating; at half of it, a quarter of the way there.
 */
export function estimateConductorTemp({
  ambientC,
  insulationRatingC,
  currentA,
  ampacityA,
}: ConductorTemperatureInput): ConductorTemperature {
  requireFinite('ambientC', ambientC);
  requireFinite('insulationRatingC', insulationRatingC);
  requireNonNegative('currentA', currentA);
  requirePositive('ampacityA', ampacityA);
  const rise = Math.max(0, insulationRatingC - ambientC) * (currentA / ampacityA) ** 2;
  const conductorTempC = ambientC + rise;
  const r = (n: number) => String(Number(n.toFixed(1)));
  return {
    conductorTempC,
    working: `Conductor temperature ${r(ambientC)} + (${r(insulationRatingC)} − ${r(ambientC)}) × (${r(currentA)} / ${r(ampacityA)})² = ${r(conductorTempC)} °C (FAA AC 43.13-1B ¶11-66)`,
  };
}
