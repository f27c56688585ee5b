import { describe, expect, it } from 'vitest';
import {
  awgAreaMm2,
  awgDiameterMm,
  editableWireSize,
  formatWireSize,
  nearestAwg,
  parseAwgGauge,
  parseWireSize,
} from '#shared/domain/wire-sizes.ts';

const INCH_MM = 25.4;

describe('AWG by the ASTM B258 formula', () => {
  // Solid copper wire table, "Lessons in Electric Circuits" vol. I ch. 12, diameters in inches.
  it.each([
    [4, 0.2043],
    [8, 0.1285],
    [10, 0.1019],
    [12, 0.08081],
    [14, 0.06408],
    [16, 0.05082],
    [18, 0.0403],
    [20, 0.03196],
    [22, 0.02535],
  ])('%i AWG is %f in across', (gauge, inches) => {
    expect(awgDiameterMm(gauge) / INCH_MM).toBeCloseTo(inches, 4);
  });

  it('gives areas from the diameter', () => {
    // 18 AWG: d = 1.0237 mm → 0.8231 mm² [C] from the formula above.
    expect(awgAreaMm2(18)).toBeCloseTo(0.8231, 3);
    // 10 AWG: 5.261 mm² [C].
    expect(awgAreaMm2(10)).toBeCloseTo(5.261, 2);
  });

  it('reads gauges as people write them', () => {
    expect(parseAwgGauge('18')).toBe(18);
    expect(parseAwgGauge('18 AWG')).toBe(18);
    expect(parseAwgGauge('4/0')).toBe(-3);
    expect(parseAwgGauge('00')).toBe(-1);
    expect(parseAwgGauge('31')).toBeNull();
    expect(parseAwgGauge('eighteen')).toBeNull();
  });

  it('finds the nearest gauge to a metric size', () => {
    expect(nearestAwg(0.75)).toBe(18); // 0.823 mm² is nearest by ratio
    expect(nearestAwg(0.5)).toBe(20); // 0.518 mm²
    expect(nearestAwg(2.5)).toBe(13); // 2.63 mm²
  });
});

describe('entering and showing sizes in the workshop unit', () => {
  it('stores ISO 6722 sizes as typed and refuses others', () => {
    expect(parseWireSize('0.75', 'mm2')).toEqual({ ok: true, areaMm2: 0.75 });
    expect(parseWireSize('1,5', 'mm2')).toEqual({ ok: true, areaMm2: 1.5 });
    expect(parseWireSize('2.5 mm²', 'awg')).toEqual({ ok: true, areaMm2: 2.5 });
    const bad = parseWireSize('0.8', 'mm2');
    expect(bad.ok).toBe(false);
    expect(!bad.ok && bad.error).toMatch(/ISO 6722/);
    expect(parseWireSize('', 'mm2')).toEqual({ ok: true, areaMm2: null });
  });

  it('stores AWG entries as their area in mm² and shows them back as AWG', () => {
    const parsed = parseWireSize('18', 'awg');
    expect(parsed.ok && parsed.areaMm2).toBeCloseTo(0.8231, 3);
    const area = parsed.ok ? parsed.areaMm2! : 0;
    expect(formatWireSize(area, 'awg')).toBe('18 AWG');
    expect(editableWireSize(area, 'awg')).toBe('18');
    expect(formatWireSize(area, 'mm2')).toBe('0.823 mm²');
    expect(parseWireSize('4 awg', 'mm2').ok).toBe(true);
  });

  it('shows a metric size in an AWG workshop by its own exact label, never a "≈" gauge', () => {
    // Automotive cable is sold in even gauges and ISO 6722 sizes: "≈17 AWG" names nothing sold.
    expect(formatWireSize(0.75, 'awg')).toBe('0.75 mm²');
    expect(formatWireSize(1, 'awg')).toBe('1 mm²');
    for (const size of [0.22, 0.35, 0.5, 0.75, 1, 1.5, 2, 2.5, 3, 4, 6, 10, 16, 25, 35, 50, 70]) {
      expect(formatWireSize(size, 'awg')).not.toMatch(/≈/);
    }
    expect(formatWireSize(0.75, 'mm2')).toBe('0.75 mm²');
    expect(formatWireSize(null, 'mm2')).toBe('');
  });
});
