/**
 * Resistance of copper conductors at a conductor temperature.
 */
import { exactIsoSize } from '../wire-sizes.ts';
import { requireFinite, requirePositive } from './guards.ts';
import type { SourceId } from './sources.ts';

/** IEC 60028 / IEC 60287-1-1 Table 1: annealed copper (100 % IACS) at 20 °C, Ω·mm²/m. */
export const COPPER_RESISTIVITY_OHM_MM2_PER_M = 0.017241;

/** IACS temperature coefficient of resistance of annealed copper at 20 °C, per °C. */
export const COPPER_ALPHA_20_PER_C = 0.00393;

/** Below this the linear model gives zero or negative resistance (20 − 1/α ≈ −234.5 °C). */
const LOWEST_TEMP_C = 20 - 1 / COPPER_ALPHA_20_PER_C;

/**
 * ISO 6722-1 maximum conductor resistance at 20 °C, mΩ/m, by nominal size in mm², as stated by
 * cable makers' datasheets claiming ISO 6722 compliance (the standard's own table was not read).
 */
export const ISO_6722_MAX_RESISTANCE_MOHM_PER_M: Readonly<Record<number, number>> = {
  0.35: 54.4,
  0.5: 37.1,
  0.75: 24.7,
  1: 18.5,
  1.5: 12.7,
  2: 9.42,
  2.5: 7.6,
  3: 6.15,
  4: 4.71,
  6: 3.14,
  10: 1.82,
  16: 1.16,
};

export type ResistanceModel = 'iacs' | 'iso6722-max';

/** R_T / R₂₀ = 1 + α₂₀ (T − 20): IACS linear model. */
export function copperTemperatureFactor(conductorTempC: number): number {
  requireFinite('conductorTempC', conductorTempC);
  if (conductorTempC <= LOWEST_TEMP_C) {
    throw new RangeError(`conductorTempC ${conductorTempC} °C is below the copper model's range`);
  }
  return 1 + COPPER_ALPHA_20_PER_C * (conductorTempC - 20);
}

/** The ISO 6722 maximum resistance at 20 °C for this area, Ω/m; null for a size not listed. */
export function iso6722MaxResistanceOhmPerM(areaMm2: number): number | null {
  const size = exactIsoSize(areaMm2);
  const mOhm = size === null ? undefined : ISO_6722_MAX_RESISTANCE_MOHM_PER_M[size];
  return mOhm === undefined ? null : mOhm / 1000;
}

export interface ConductorResistanceInput {
  areaMm2: number;
  lengthM: number;
  conductorTempC?: number;
  /** Overrides the IACS value (a worked example's ρ, say); used by 'iacs' and the ISO fallback. */
  resistivityOhmMm2PerM?: number;
  model?: ResistanceModel;
}

export interface ConductorResistance {
  resistanceOhm: number;
  /** Resistance per metre at 20 °C before the temperature correction, Ω/m. */
  ohmPerM20: number;
  temperatureFactor: number;
  /** The model actually used: 'iso6722-max' falls back to 'iacs' for sizes the table lacks. */
  modelUsed: ResistanceModel;
  notes: string[];
  sources: SourceId[];
}

/**
 * Resistance of a length of copper conductor: R = ρ·L/A at 20 °C (or the ISO 6722 maximum per
 * metre), corrected to the conductor temperature by R_T = R₂₀·(1 + α(T − 20)).
 */
export function conductorResistance({
  areaMm2,
  lengthM,
  conductorTempC = 20,
  resistivityOhmMm2PerM = COPPER_RESISTIVITY_OHM_MM2_PER_M,
  model = 'iacs',
}: ConductorResistanceInput): ConductorResistance {
  requirePositive('areaMm2', areaMm2);
  requirePositive('lengthM', lengthM);
  requirePositive('resistivityOhmMm2PerM', resistivityOhmMm2PerM);
  const temperatureFactor = copperTemperatureFactor(conductorTempC);
  const notes: string[] = [];
  const sources: SourceId[] = [];

  let ohmPerM20: number;
  let modelUsed: ResistanceModel = 'iacs';
  const isoOhmPerM = model === 'iso6722-max' ? iso6722MaxResistanceOhmPerM(areaMm2) : null;
  if (isoOhmPerM !== null) {
    ohmPerM20 = isoOhmPerM;
    modelUsed = 'iso6722-max';
    sources.push('iso-6722');
    notes.push(
      `${exactIsoSize(areaMm2)} mm²: ISO 6722 maximum conductor resistance ${(isoOhmPerM * 1000).toFixed(3)} mΩ/m at 20 °C.`,
    );
  } else {
    ohmPerM20 = resistivityOhmMm2PerM / areaMm2;
    if (model === 'iso6722-max') {
      notes.push(
        `${areaMm2} mm² is not in the ISO 6722 maximum-resistance table held; resistance from annealed-copper resistivity instead.`,
      );
    }
    if (resistivityOhmMm2PerM === COPPER_RESISTIVITY_OHM_MM2_PER_M) {
      sources.push('iacs-copper');
    } else {
      notes.push(`Resistivity ${resistivityOhmMm2PerM} Ω·mm²/m as given, not the IACS value.`);
    }
  }
  if (conductorTempC !== 20) {
    sources.push('iacs-copper');
    notes.push(
      `Corrected from 20 °C to ${conductorTempC} °C: × ${temperatureFactor.toFixed(4)} (α₂₀ = ${COPPER_ALPHA_20_PER_C} /°C).`,
    );
  }
  return {
    resistanceOhm: ohmPerM20 * lengthM * temperatureFactor,
    ohmPerM20,
    temperatureFactor,
    modelUsed,
    notes,
    sources: [...new Set(sources)],
  };
}

/** The resistance alone, Ω. */
export function conductorResistanceOhm(input: ConductorResistanceInput): number {
  return conductorResistance(input).resistanceOhm;
}
