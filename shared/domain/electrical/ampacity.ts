/**
 * Ampacity of a copper conductor from 33 CFR 183.425 Table 5 (US Coast Guard; reproduced by ABYC
 * E-11): public domain, written for the low-voltage wiring of boats, and the closest published
 * table to a 12 V vehicle loom. Table values are for conductors outside engine spaces at 30 °C.
 */
import { awgAreaMm2, exactAwg, formatAwgGauge } from '../wire-sizes.ts';
import { requireFinite, requirePositive } from './guards.ts';
import type { SourceId } from './sources.ts';

/** Insulation temperature ratings that head the columns of Table 5, °C. */
export const TABLE_5_INSULATION_COLUMNS_C = [60, 75, 80, 90, 105, 125, 200] as const;
export type InsulationColumnC = (typeof TABLE_5_INSULATION_COLUMNS_C)[number];

/** SAE J1128 GPT (PVC) insulation, °C: the common rating that falls between two columns. */
export const SAE_J1128_GPT_C = 85;

/** The AWG rows of Table 5, thinnest first: 18 … 1, then 1/0 … 4/0 as 0, −1, −2, −3. */
export const TABLE_5_AWG_ROWS = [18, 16, 14, 12, 10, 8, 6, 4, 3, 2, 1, 0, -1, -2, -3] as const;
export type Table5Awg = (typeof TABLE_5_AWG_ROWS)[number];

/**
 * 33 CFR 183.425 Table 5: allowable amperage, A, outside engine spaces, 30 °C ambient. Every row
 * and column as published, read at a reprint of the regulation's text (33 CFR 183.425, "Table 5 —
 * Allowable Amperage of Conductors"); the 18…4 AWG rows were read again at the same page.
 */
export const TABLE_5_AMPACITY_A: Readonly<
  Record<Table5Awg, Readonly<Record<InsulationColumnC, number>>>
> = {
  18: { 60: 10, 75: 10, 80: 15, 90: 20, 105: 20, 125: 25, 200: 25 },
  16: { 60: 15, 75: 15, 80: 20, 90: 25, 105: 25, 125: 30, 200: 35 },
  14: { 60: 20, 75: 20, 80: 25, 90: 30, 105: 35, 125: 40, 200: 45 },
  12: { 60: 25, 75: 25, 80: 35, 90: 40, 105: 45, 125: 50, 200: 55 },
  10: { 60: 40, 75: 40, 80: 50, 90: 55, 105: 60, 125: 70, 200: 70 },
  8: { 60: 55, 75: 65, 80: 70, 90: 70, 105: 80, 125: 90, 200: 100 },
  6: { 60: 80, 75: 95, 80: 100, 90: 100, 105: 120, 125: 125, 200: 135 },
  4: { 60: 105, 75: 125, 80: 130, 90: 135, 105: 160, 125: 170, 200: 180 },
  3: { 60: 120, 75: 145, 80: 150, 90: 155, 105: 180, 125: 195, 200: 210 },
  2: { 60: 140, 75: 170, 80: 175, 90: 180, 105: 210, 125: 225, 200: 240 },
  1: { 60: 165, 75: 195, 80: 210, 90: 210, 105: 245, 125: 265, 200: 280 },
  0: { 60: 195, 75: 230, 80: 245, 90: 245, 105: 285, 125: 305, 200: 325 },
  [-1]: { 60: 225, 75: 265, 80: 285, 90: 285, 105: 330, 125: 355, 200: 370 },
  [-2]: { 60: 260, 75: 310, 80: 330, 90: 330, 105: 385, 125: 410, 200: 430 },
  [-3]: { 60: 300, 75: 360, 80: 385, 90: 385, 105: 445, 125: 475, 200: 510 },
};

/**
 * Table 5 note 1: multipliers inside engine spaces (they take the table from 30 °C to 50 °C
 * ambient). 75 0.75, 80 0.78, 90 0.82, 105 0.85, 125 0.89, 200 1.00: ABYC E-11 Table VI-B, engine-room
 * column ÷ outside column (a secondary transcription), 105 °C also read in wire makers' reprints of
 * note 1. 60 °C 0.58 is from memory: no source held gives it.
 */
export const ENGINE_SPACE_FACTORS: Readonly<Record<InsulationColumnC, number>> = {
  60: 0.58,
  75: 0.75,
  80: 0.78,
  90: 0.82,
  105: 0.85,
  125: 0.89,
  200: 1.0,
};

/** Which engine-space factors were read at a source; the rest are from memory. */
export const ENGINE_SPACE_FACTOR_VERIFIED: Readonly<Record<InsulationColumnC, boolean>> = {
  60: false,
  75: true,
  80: true,
  90: true,
  105: true,
  125: true,
  200: true,
};

/**
 * The Table 5 column for an insulation rating: the column itself, or the next LOWER column for a
 * rating between two (SAE J1128 GPT, 85 °C → 80 °C column). Conservative: never credits the wire
 * with more than its rating. Null below 60 °C, which the table does not cover.
 */
export function insulationColumnC(insulationRatingC: number): InsulationColumnC | null {
  requireFinite('insulationRatingC', insulationRatingC);
  let column: InsulationColumnC | null = null;
  for (const c of TABLE_5_INSULATION_COLUMNS_C) if (c <= insulationRatingC) column = c;
  return column;
}

function columnOrThrow(insulationRatingC: number): InsulationColumnC {
  const column = insulationColumnC(insulationRatingC);
  if (column === null) {
    throw new RangeError(
      `insulation rated ${insulationRatingC} °C is below Table 5's lowest column (60 °C)`,
    );
  }
  return column;
}

function isTable5Awg(awg: number): awg is Table5Awg {
  return (TABLE_5_AWG_ROWS as readonly number[]).includes(awg);
}

/** Table 5 ampacity, A, for a row and an insulation rating (by the column rule above). */
export function tableAmpacityA(awg: number, insulationRatingC: number): number {
  if (!isTable5Awg(awg)) {
    throw new RangeError(`${awg} AWG is not a row of Table 5 (${TABLE_5_AWG_ROWS.join(', ')})`);
  }
  return TABLE_5_AMPACITY_A[awg][columnOrThrow(insulationRatingC)];
}

/** Note 1 factor inside an engine space for an insulation rating (by the column rule). */
export function engineSpaceFactor(insulationRatingC: number): number {
  return ENGINE_SPACE_FACTORS[columnOrThrow(insulationRatingC)];
}

/**
 * Table 5 note 2 / 33 CFR 183.435(b): factor for conductors bundled together. The regulation
 * applies it only at 50 V or more; below that it is a conservative choice.
 */
export function bundleFactor(bundled: number): number {
  if (!Number.isInteger(bundled) || bundled < 1) {
    throw new RangeError(`bundled must be a whole number of conductors ≥ 1, got ${bundled}`);
  }
  if (bundled <= 2) return 1;
  if (bundled === 3) return 0.7;
  if (bundled <= 6) return 0.6;
  if (bundled <= 24) return 0.5;
  return 0.4;
}

export type SizeRule =
  /** An AWG size that is a row of the table. */
  | 'table-row'
  /** Any other size between 18 and 4 AWG: the largest row whose area does not exceed it. */
  | 'largest-row-not-exceeding'
  /** Thinner than 18 AWG: the 18 AWG value scaled down by area. */
  | 'scaled-below-18-awg'
  /** Thicker than 4/0 AWG, the largest row: rated as 4/0 AWG. */
  | 'capped-at-4-0-awg';

export interface TableRow {
  tableAwg: Table5Awg;
  rule: SizeRule;
  /** Area ratio applied to the row's value: below 1 only for sizes thinner than 18 AWG. */
  areaScale: number;
}

const THINNEST_ROW: Table5Awg = 18;
const THICKEST_ROW: Table5Awg = -3;

/**
 * The Table 5 row a conductor area is rated by. The table is in AWG; a metric size takes the
 * largest AWG row whose area does not exceed it (1 mm² → 18, 2.5 mm² → 14, 6 mm² → 10), so a wire is never
 * credited with a thicker wire's ampacity.
 */
export function table5RowForArea(areaMm2: number): TableRow {
  requirePositive('areaMm2', areaMm2);
  // A stored AWG area is rounded: match the gauge within 1 % so 14 AWG is not rated as 16 AWG.
  const gauge = exactAwg(areaMm2);
  if (gauge !== null && isTable5Awg(gauge))
    return { tableAwg: gauge, rule: 'table-row', areaScale: 1 };
  const thinnestArea = awgAreaMm2(THINNEST_ROW);
  if (areaMm2 < thinnestArea) {
    return {
      tableAwg: THINNEST_ROW,
      rule: 'scaled-below-18-awg',
      areaScale: areaMm2 / thinnestArea,
    };
  }
  if (areaMm2 > awgAreaMm2(THICKEST_ROW)) {
    return { tableAwg: THICKEST_ROW, rule: 'capped-at-4-0-awg', areaScale: 1 };
  }
  let row: Table5Awg = THINNEST_ROW;
  for (const awg of TABLE_5_AWG_ROWS) if (awgAreaMm2(awg) <= areaMm2) row = awg;
  return { tableAwg: row, rule: 'largest-row-not-exceeding', areaScale: 1 };
}

export type Zone = 'cabin' | 'engine_bay';

export interface WireAmpacityInput {
  areaMm2: number;
  insulationRatingC: number;
  zone: Zone;
  /** Conductors bundled together, this one included. */
  bundled?: number;
  /** Off by default: the regulation requires bundle factors only at 50 V or more. */
  applyBundleDerating?: boolean;
}

export interface WireAmpacity {
  /** Derated ampacity, A: the figure a fuse is checked against. Not rounded. */
  ampacityA: number;
  tableAwg: Table5Awg;
  /** The Table 5 cell, A, before scaling and derating. */
  tableAmpacityA: number;
  /** The table value after scaling by area (thinner than 18 AWG only), before derating, A. */
  baseAmpacityA: number;
  insulationColumnC: InsulationColumnC;
  sizeRule: SizeRule;
  engineSpaceFactor: number;
  bundleFactor: number;
  /** engineSpaceFactor × bundleFactor. */
  deratingFactor: number;
  /** True when the size lies outside the rows of Table 5 held here. */
  extrapolated: boolean;
  notes: string[];
  sources: SourceId[];
}

const fmt = (n: number) => String(Number(n.toFixed(2)));

/** Derated ampacity of a copper conductor: Table 5, the column rule, note 1, note 2 if asked. */
export function wireAmpacity({
  areaMm2,
  insulationRatingC,
  zone,
  bundled = 1,
  applyBundleDerating = false,
}: WireAmpacityInput): WireAmpacity {
  const column = columnOrThrow(insulationRatingC);
  const row = table5RowForArea(areaMm2);
  const cell = TABLE_5_AMPACITY_A[row.tableAwg][column];
  const notes: string[] = [];
  const sources: SourceId[] = ['uscg-183-425'];
  const rowLabel = `${formatAwgGauge(row.tableAwg)} AWG`;

  if (column !== insulationRatingC) {
    const gpt = insulationRatingC === SAE_J1128_GPT_C;
    if (gpt) sources.push('sae-j1128');
    notes.push(
      `Insulation rated ${insulationRatingC} °C${gpt ? ' (SAE J1128 GPT)' : ''} falls between Table 5 columns: rated by the next lower column, ${column} °C (conservative).`,
    );
  }
  if (row.rule === 'largest-row-not-exceeding') {
    notes.push(
      `${fmt(areaMm2)} mm² is rated as ${rowLabel} (${fmt(awgAreaMm2(row.tableAwg))} mm²), the largest Table 5 row whose area does not exceed it (conservative).`,
    );
  } else if (row.rule === 'scaled-below-18-awg') {
    sources.push('common-practice');
    notes.push(
      `${fmt(areaMm2)} mm² is thinner than 18 AWG, the smallest row of Table 5: the 18 AWG value scaled by area (× ${row.areaScale.toFixed(3)}); common practice, no source. Conservative, as ampacity falls more slowly than area.`,
    );
  } else if (row.rule === 'capped-at-4-0-awg') {
    notes.push(
      `${fmt(areaMm2)} mm² is thicker than 4/0 AWG, the largest row of Table 5: rated as 4/0 AWG (conservative).`,
    );
  }

  const engine = zone === 'engine_bay' ? ENGINE_SPACE_FACTORS[column] : 1;
  if (zone === 'engine_bay') {
    notes.push(
      `Engine bay: × ${engine} for ${column} °C insulation (Table 5 note 1, which assumes 50 °C around the wire${ENGINE_SPACE_FACTOR_VERIFIED[column] ? '' : '; this factor is from memory, not read at the source'}). Near exhausts and turbochargers a vehicle's engine bay runs hotter: route away from them or use higher-rated insulation.`,
    );
  }

  const bundleTableFactor = bundleFactor(bundled);
  const bundle = applyBundleDerating ? bundleTableFactor : 1;
  if (bundled >= 3) {
    sources.push('uscg-183-435');
    notes.push(
      applyBundleDerating
        ? `Bundled with ${bundled - 1} other conductors: × ${bundle} (33 CFR 183.435 / Table 5 note 2). The regulation requires this only at 50 V or more; below that it is a conservative choice.`
        : `Bundled with ${bundled - 1} other conductors: bundle factor not applied (33 CFR 183.435 requires it only at 50 V or more); applying × ${bundleTableFactor} would be the conservative choice.`,
    );
  }

  const baseAmpacityA = cell * row.areaScale;
  const deratingFactor = engine * bundle;
  return {
    ampacityA: baseAmpacityA * deratingFactor,
    tableAwg: row.tableAwg,
    tableAmpacityA: cell,
    baseAmpacityA,
    insulationColumnC: column,
    sizeRule: row.rule,
    engineSpaceFactor: engine,
    bundleFactor: bundle,
    deratingFactor,
    extrapolated: row.rule === 'scaled-below-18-awg' || row.rule === 'capped-at-4-0-awg',
    notes,
    sources: [...new Set(sources)],
  };
}
