/**
 * Resistance of copper conductors at a conductor temperature.
 */
import { exactAwg, exactIsoSize, formatAwgGauge } from '../wire-sizes.ts';
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

/** One circular mil in mm²: π/4 × (0.0254 mm)² [C]. */
export const CIRCULAR_MIL_MM2 = 5.067e-4;

/**
 * SAE J1128 minimum conductor areas of automotive AWG cable, circular mils, as reprinted in a wire
 * maker's catalogue appendix (the standard's own table not read): 5–11 % below the ASTM B258 nominal
 * areas. Published 12 V / 3 % drop tables (ABYC E-11 Table IX) are built on these areas.
 */
export const SAE_J1128_MIN_AREA_CMIL: Readonly<Record<number, number>> = {
  18: 1537,
  16: 2336,
  14: 3702,
  12: 5833,
  10: 9343,
  8: 14810,
  6: 24538,
  4: 37360,
};

/**
 * Which area an AWG size's resistance is worked from: the SAE J1128 minimum that automotive cable
 * is made to (the default: a drop worked on it is never better than the cable bought), or the ASTM
 * B258 nominal area of the gauge.
 */
export type AwgAreaBasis = 'sae-j1128-min' | 'astm-b258-nominal';

/**
 * The area, mm², resistance is worked from. An AWG size on the J1128 basis takes its minimum area
 * where one is held (18 … 4 AWG); every other size is its own area.
 */
export function resistanceAreaMm2(
  areaMm2: number,
  basis: AwgAreaBasis = 'sae-j1128-min',
): { areaMm2: number; basisUsed: AwgAreaBasis | 'as-given'; note: string | null } {
  const gauge = exactAwg(areaMm2);
  if (gauge === null || exactIsoSize(areaMm2) !== null)
    return { areaMm2, basisUsed: 'as-given', note: null };
  const cmil = SAE_J1128_MIN_AREA_CMIL[gauge];
  const label = `${formatAwgGauge(gauge)} AWG`;
  if (basis === 'astm-b258-nominal') {
    return {
      areaMm2,
      basisUsed: 'astm-b258-nominal',
      note: `${label} worked at its ASTM B258 nominal area, ${areaMm2.toFixed(3)} mm², as asked.`,
    };
  }
  if (cmil === undefined) {
    return {
      areaMm2,
      basisUsed: 'astm-b258-nominal',
      note: `No SAE J1128 minimum area is held for ${label}: worked at its ASTM B258 nominal area, ${areaMm2.toFixed(3)} mm².`,
    };
  }
  const minMm2 = cmil * CIRCULAR_MIL_MM2;
  return {
    areaMm2: minMm2,
    basisUsed: 'sae-j1128-min',
    note: `${label} automotive cable is made to the SAE J1128 minimum area, ${cmil} cmil = ${minMm2.toFixed(3)} mm² (nominal ${areaMm2.toFixed(3)} mm²): resistance worked from the minimum.`,
  };
}

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
  /** For an AWG size: the area worked from (default the SAE J1128 minimum). */
  awgAreaBasis?: AwgAreaBasis;
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
  awgAreaBasis = 'sae-j1128-min',
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
    const worked = resistanceAreaMm2(areaMm2, awgAreaBasis);
    ohmPerM20 = resistivityOhmMm2PerM / worked.areaMm2;
    if (worked.note) notes.push(worked.note);
    if (worked.basisUsed === 'sae-j1128-min') sources.push('sae-j1128-area');
    if (worked.basisUsed === 'astm-b258-nominal') sources.push('astm-b258');
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
      `Corrected from 20 °C to ${Number(conductorTempC.toFixed(1))} °C: × ${temperatureFactor.toFixed(4)} (α₂₀ = ${COPPER_ALPHA_20_PER_C} /°C).`,
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
