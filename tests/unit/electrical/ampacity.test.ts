import { describe, expect, it } from 'vitest';
import {
  bundleFactor,
  ENGINE_SPACE_FACTOR_VERIFIED,
  ENGINE_SPACE_FACTORS,
  engineSpaceFactor,
  insulationColumnC,
  table5RowForArea,
  tableAmpacityA,
  TABLE_5_INSULATION_COLUMNS_C,
  wireAmpacity,
} from '#shared/domain/electrical/ampacity.ts';
import { awgAreaMm2 } from '#shared/domain/wire-sizes.ts';

const COLUMNS = [60, 75, 80, 90, 105, 125, 200] as const;

describe('33 CFR 183.425 Table 5', () => {
  // 33 CFR 183.425 Table 5, outside engine spaces, 30 °C ambient: every row and column as read at
  // a reprint of the regulation's text (18 … 4 also in references.md; the 105 °C column of 3 … 4/0
  // read again by a reviewer: 180, 210, 245, 285, 330, 385, 445). Gauge 0, −1, −2, −3 = 1/0 … 4/0.
  it.each([
    [18, [10, 10, 15, 20, 20, 25, 25]],
    [16, [15, 15, 20, 25, 25, 30, 35]],
    [14, [20, 20, 25, 30, 35, 40, 45]],
    [12, [25, 25, 35, 40, 45, 50, 55]],
    [10, [40, 40, 50, 55, 60, 70, 70]],
    [8, [55, 65, 70, 70, 80, 90, 100]],
    [6, [80, 95, 100, 100, 120, 125, 135]],
    [4, [105, 125, 130, 135, 160, 170, 180]],
    [3, [120, 145, 150, 155, 180, 195, 210]],
    [2, [140, 170, 175, 180, 210, 225, 240]],
    [1, [165, 195, 210, 210, 245, 265, 280]],
    [0, [195, 230, 245, 245, 285, 305, 325]],
    [-1, [225, 265, 285, 285, 330, 355, 370]],
    [-2, [260, 310, 330, 330, 385, 410, 430]],
    [-3, [300, 360, 385, 385, 445, 475, 510]],
  ])('row %i AWG', (awg, amps) => {
    COLUMNS.forEach((column, i) => expect(tableAmpacityA(awg, column)).toBe(amps[i]));
  });

  it('has the columns of the regulation', () => {
    expect(TABLE_5_INSULATION_COLUMNS_C).toEqual(COLUMNS);
  });

  it('refuses rows it does not hold', () => {
    expect(() => tableAmpacityA(20, 105)).toThrow(RangeError);
    expect(() => tableAmpacityA(13, 105)).toThrow(RangeError);
    expect(() => tableAmpacityA(-4, 105)).toThrow(RangeError);
  });
});

describe('insulation ratings between columns', () => {
  it('take the next lower column', () => {
    // SAE J1128 GPT is rated 85 °C: the 80 °C column (conservative).
    expect(insulationColumnC(85)).toBe(80);
    expect(tableAmpacityA(18, 85)).toBe(15); // Table 5, 18 AWG, 80 °C
    expect(tableAmpacityA(12, 85)).toBe(35); // Table 5, 12 AWG, 80 °C
    // [C] by the rule: 150 °C → 125 °C column; 250 °C → 200 °C column; a column maps to itself.
    expect(insulationColumnC(150)).toBe(125);
    expect(insulationColumnC(250)).toBe(200);
    expect(insulationColumnC(105)).toBe(105);
    expect(insulationColumnC(59)).toBeNull();
    expect(() => tableAmpacityA(18, 50)).toThrow(RangeError);
  });

  it('say so in the working', () => {
    const r = wireAmpacity({ areaMm2: awgAreaMm2(16), insulationRatingC: 85, zone: 'cabin' });
    expect(r.insulationColumnC).toBe(80);
    expect(r.ampacityA).toBe(20); // Table 5, 16 AWG, 80 °C
    expect(r.notes.join(' ')).toMatch(/SAE J1128 GPT.*next lower column, 80 °C/);
    expect(r.sources).toContain('sae-j1128');
  });
});

describe('engine spaces (Table 5 note 1)', () => {
  // Published engine-space ampacities of 105 °C wire (boat-cable makers' tables citing 33 CFR
  // 183.425, "de-rating for engine space is 0.85"). They are table × 0.85 rounded to the whole
  // ampere, in both directions: 14 AWG 29.75 → 30, 12 AWG 38.25 → 38. Loomwright does not round.
  it.each([
    [18, 17],
    [16, 21],
    [14, 30],
    [12, 38],
    [10, 51],
    [8, 68],
    [6, 102], // same published table, read at the maker's page (not in references.md)
    [4, 136], // same published table, read at the maker's page (not in references.md)
  ])('105 °C %i AWG is %i A inside an engine space', (awg, published) => {
    const r = wireAmpacity({
      areaMm2: awgAreaMm2(awg),
      insulationRatingC: 105,
      zone: 'engine_bay',
    });
    expect(r.engineSpaceFactor).toBe(0.85);
    expect(Math.abs(r.ampacityA - published)).toBeLessThanOrEqual(0.5);
    // [C] exactly table × 0.85
    expect(r.ampacityA).toBeCloseTo(tableAmpacityA(awg, 105) * 0.85, 9);
  });

  it('uses the note 1 factor of each insulation column', () => {
    // ABYC E-11 Table VI-B engine-room column ÷ outside column (secondary transcription, [V] in
    // references.md): 75 0.75, 80 0.78, 90 0.82, 105 0.85, 125 0.89, 200 1.00; 105 °C also in two
    // wire makers' reprints of note 1. 60 °C 0.58 is from memory.
    expect(ENGINE_SPACE_FACTORS).toEqual({
      60: 0.58,
      75: 0.75,
      80: 0.78,
      90: 0.82,
      105: 0.85,
      125: 0.89,
      200: 1.0,
    });
    expect(Object.entries(ENGINE_SPACE_FACTOR_VERIFIED).filter(([, v]) => !v)).toEqual([
      ['60', false],
    ]);
    // [C] hotter-rated insulation keeps more of its rating in a hot space: never a lower factor.
    const factors = COLUMNS.map((c) => ENGINE_SPACE_FACTORS[c]);
    factors.slice(1).forEach((f, i) => expect(f).toBeGreaterThanOrEqual(factors[i]!));
    expect(engineSpaceFactor(85)).toBe(0.78); // by the column rule, 80 °C
  });

  it('gives the check values of the issue', () => {
    // [C] 2 AWG, 105 °C, engine bay: Table 5 210 A × 0.85 = 178.5 A.
    const two = wireAmpacity({
      areaMm2: awgAreaMm2(2),
      insulationRatingC: 105,
      zone: 'engine_bay',
    });
    expect(two.ampacityA).toBeCloseTo(178.5, 6);
    expect(two.extrapolated).toBe(false);
    // Table 5, 1/0 AWG, 105 °C, outside engine spaces: 285 A.
    const zero = wireAmpacity({ areaMm2: awgAreaMm2(0), insulationRatingC: 105, zone: 'cabin' });
    expect(zero.ampacityA).toBe(285);
    // [C] 16 AWG, 80 °C, engine space: 20 × 0.78 = 15.6 A (references.md check value).
    const sixteen = wireAmpacity({
      areaMm2: awgAreaMm2(16),
      insulationRatingC: 80,
      zone: 'engine_bay',
    });
    expect(sixteen.ampacityA).toBeCloseTo(15.6, 9);
    // [C] 85 °C GPT cable is rated by the 80 °C column: 14 AWG in the engine bay 25 × 0.78 = 19.5 A.
    expect(
      wireAmpacity({ areaMm2: awgAreaMm2(14), insulationRatingC: 85, zone: 'engine_bay' })
        .ampacityA,
    ).toBeCloseTo(19.5, 9);
  });

  it('marks a factor from memory in the working', () => {
    // [C] 12 AWG, 60 °C, engine bay: 25 × 0.58 = 14.5 A (0.58 from memory)
    const r = wireAmpacity({ areaMm2: awgAreaMm2(12), insulationRatingC: 60, zone: 'engine_bay' });
    expect(r.ampacityA).toBeCloseTo(14.5, 9);
    expect(r.notes.join(' ')).toMatch(/from memory/);
    const verified = wireAmpacity({
      areaMm2: awgAreaMm2(12),
      insulationRatingC: 105,
      zone: 'engine_bay',
    });
    expect(verified.notes.join(' ')).not.toMatch(/from memory/);
  });

  it('does not apply in the cabin', () => {
    const r = wireAmpacity({ areaMm2: awgAreaMm2(12), insulationRatingC: 105, zone: 'cabin' });
    expect(r.engineSpaceFactor).toBe(1);
    expect(r.ampacityA).toBe(45); // Table 5, 12 AWG, 105 °C
  });
});

describe('bundle derating', () => {
  // 33 CFR 183.435(b) / Table 5 note 2: 3 → 0.70, 4–6 → 0.60, 7–24 → 0.50, 25 and more → 0.40.
  it.each([
    [1, 1],
    [2, 1],
    [3, 0.7],
    [4, 0.6],
    [6, 0.6],
    [7, 0.5],
    [24, 0.5],
    [25, 0.4],
    [100, 0.4],
  ])('%i conductors → × %f', (count, factor) => {
    expect(bundleFactor(count)).toBe(factor);
  });

  it('refuses a count that is not a whole number of conductors', () => {
    expect(() => bundleFactor(0)).toThrow(RangeError);
    expect(() => bundleFactor(2.5)).toThrow(RangeError);
  });

  it('is off unless asked for, and says why', () => {
    const area = awgAreaMm2(14);
    const off = wireAmpacity({ areaMm2: area, insulationRatingC: 105, zone: 'cabin', bundled: 7 });
    expect(off.bundleFactor).toBe(1);
    expect(off.ampacityA).toBe(35); // Table 5, 14 AWG, 105 °C
    expect(off.notes.join(' ')).toMatch(/not applied.*50 V or more/);
    const on = wireAmpacity({
      areaMm2: area,
      insulationRatingC: 105,
      zone: 'cabin',
      bundled: 7,
      applyBundleDerating: true,
    });
    expect(on.bundleFactor).toBe(0.5);
    expect(on.ampacityA).toBeCloseTo(17.5, 9); // [C] 35 × 0.5
    expect(on.notes.join(' ')).toMatch(/only at 50 V or more.*conservative/);
    expect(on.sources).toContain('uscg-183-435');
  });

  it('multiplies with the engine-space factor', () => {
    // [C] 14 AWG, 105 °C, engine bay, 4 bundled: 35 × 0.85 × 0.60 = 17.85 A; derating 0.51.
    const r = wireAmpacity({
      areaMm2: awgAreaMm2(14),
      insulationRatingC: 105,
      zone: 'engine_bay',
      bundled: 4,
      applyBundleDerating: true,
    });
    expect(r.deratingFactor).toBeCloseTo(0.51, 9);
    expect(r.ampacityA).toBeCloseTo(17.85, 9);
  });
});

describe('metric sizes', () => {
  // The rule [C]: the largest Table 5 AWG row whose ASTM B258 area does not exceed the metric area.
  it.each([
    [1, 18, 20], // 18 AWG 0.823 mm² ≤ 1 < 16 AWG 1.31 mm²
    [1.5, 16, 25], // 1.31 ≤ 1.5 < 2.08
    [2, 16, 25], // 2 < 14 AWG 2.08 mm²
    [2.5, 14, 35], // 2.08 ≤ 2.5 < 3.31
    [4, 12, 45], // 3.31 ≤ 4 < 5.26
    [6, 10, 60], // 5.26 ≤ 6 < 8.37
    [10, 8, 80], // 8.37 ≤ 10 < 13.3
    [16, 6, 120], // 13.3 ≤ 16 < 21.2
  ])('%f mm² is rated as %i AWG (%i A at 105 °C)', (areaMm2, awg, amps) => {
    const r = wireAmpacity({ areaMm2, insulationRatingC: 105, zone: 'cabin' });
    expect(r.tableAwg).toBe(awg);
    expect(r.sizeRule).toBe('largest-row-not-exceeding');
    expect(r.ampacityA).toBe(amps); // Table 5, 105 °C column
    expect(r.extrapolated).toBe(false);
    expect(awgAreaMm2(awg)).toBeLessThanOrEqual(areaMm2);
  });

  it('rates an AWG size by its own row, even when stored rounded', () => {
    // Stored AWG areas are rounded to 4 decimals; 14 AWG must not slip to the 16 AWG row.
    const stored = Number(awgAreaMm2(14).toFixed(4));
    expect(table5RowForArea(stored)).toEqual({ tableAwg: 14, rule: 'table-row', areaScale: 1 });
    expect(table5RowForArea(awgAreaMm2(14) * 0.9999).tableAwg).toBe(14);
  });

  it('rates odd gauges by the next thinner row', () => {
    // [C] by the rule: 13 AWG (2.63 mm²) → 14; 17 AWG (1.04 mm²) → 18.
    expect(table5RowForArea(awgAreaMm2(13)).tableAwg).toBe(14);
    expect(table5RowForArea(awgAreaMm2(17)).tableAwg).toBe(18);
  });
});

describe('sizes outside the table', () => {
  it('scales the 18 AWG value down by area below 18 AWG, flagged', () => {
    // Common practice, no source. [C] 0.5 mm² at 105 °C: 20 A × 0.5 / 0.8231 = 12.15 A.
    const r = wireAmpacity({ areaMm2: 0.5, insulationRatingC: 105, zone: 'cabin' });
    expect(r.tableAwg).toBe(18);
    expect(r.tableAmpacityA).toBe(20);
    expect(r.ampacityA).toBeCloseTo((20 * 0.5) / awgAreaMm2(18), 9);
    expect(r.ampacityA).toBeCloseTo(12.15, 2);
    expect(r.extrapolated).toBe(true);
    expect(r.sizeRule).toBe('scaled-below-18-awg');
    expect(r.sources).toContain('common-practice');
    expect(r.notes.join(' ')).toMatch(/common practice, no source/);
    // [C] 0.75 mm²: 20 × 0.75 / 0.8231 = 18.22 A; 20 AWG (0.5176 mm²): 12.58 A.
    expect(
      wireAmpacity({ areaMm2: 0.75, insulationRatingC: 105, zone: 'cabin' }).ampacityA,
    ).toBeCloseTo(18.22, 2);
    expect(
      wireAmpacity({ areaMm2: awgAreaMm2(20), insulationRatingC: 105, zone: 'cabin' }).ampacityA,
    ).toBeCloseTo(12.58, 2);
  });

  it('rates sizes past 4 AWG by their own rows, and only beyond 4/0 caps, flagged', () => {
    // 25 mm² lies between 4 AWG (21.2 mm²) and 3 AWG (26.7 mm²): rated as 4 AWG, 160 A at 105 °C.
    const metric = wireAmpacity({ areaMm2: 25, insulationRatingC: 105, zone: 'cabin' });
    expect(metric.tableAwg).toBe(4);
    expect(metric.ampacityA).toBe(160);
    expect(metric.extrapolated).toBe(false);
    // 70 mm² lies between 2/0 (67.4 mm²) and 3/0 (85.0 mm²): the 2/0 row, 330 A at 105 °C.
    expect(wireAmpacity({ areaMm2: 70, insulationRatingC: 105, zone: 'cabin' }).ampacityA).toBe(
      330,
    );
    // Thicker than 4/0 (107.2 mm²): rated as 4/0, 445 A, flagged.
    const huge = wireAmpacity({ areaMm2: 120, insulationRatingC: 105, zone: 'cabin' });
    expect(huge.tableAwg).toBe(-3);
    expect(huge.ampacityA).toBe(445);
    expect(huge.extrapolated).toBe(true);
    expect(huge.sizeRule).toBe('capped-at-4-0-awg');
  });

  it('refuses insulation below the table and sizes that are not sizes', () => {
    expect(() => wireAmpacity({ areaMm2: 1, insulationRatingC: 50, zone: 'cabin' })).toThrow(
      RangeError,
    );
    expect(() => wireAmpacity({ areaMm2: 0, insulationRatingC: 105, zone: 'cabin' })).toThrow(
      RangeError,
    );
  });
});
