import { describe, expect, it } from 'vitest';
import { showFinding, showSizes } from '#shared/domain/checks/finding-sizes.ts';
import { storedFindings } from '#shared/domain/checks/run-checks.ts';
import { storedAwgAreaMm2 } from '#shared/domain/wire-sizes.ts';
import { snapshot } from '../../factories/snapshot.factory.ts';

// The case of feed-rules.test.ts: 1.0 mm² under a 30 A fuse in the engine bay is rated 17 A
// (33 CFR 183.425 Table 5, 18 AWG row, 105 °C, × 0.85 in an engine space).
const underFused = snapshot({
  feeds: [
    {
      fuseA: 30,
      wire: {
        sizeMm2: 1,
        insulationRatingC: 105,
        lengthM: 1,
        zone: 'engine_bay',
        bundled: 1,
        returnPath: 'wire',
        colour: '',
      },
      loads: [{ id: 1, pinId: null, name: 'Fan', currentA: 20, continuous: true }],
    },
  ],
});

describe('sizes in findings', () => {
  it('are stored as numbers and written in the unit of whoever shows the finding', () => {
    const [stored] = storedFindings(underFused, { sizeUnit: 'mm2' }).filter(
      (f) => f.rule === 'fuse_protects_wire',
    );
    expect(stored!.message).not.toMatch(/mm²|AWG/);
    expect(stored!.values.wireSize?.value).toBe('⟦size:1⟧');

    const inMm2 = showFinding(stored!, 'mm2');
    expect(inMm2.message).toMatch(/than its 1 mm² wire/);
    expect(inMm2.values.suggestedSize?.value).toBe('4 mm²');
    // The same stored finding in an AWG workshop: its sizes in AWG, no mark left anywhere.
    const inAwg = showFinding(stored!, 'awg');
    // A metric wire keeps its exact label in an AWG workshop: never a "≈" gauge nobody sells.
    expect(inAwg.values.wireSize?.value).toBe('1 mm²');
    expect(inAwg.message).toMatch(/than its 1 mm² wire.*at least 4 mm²/);
    expect(inAwg.message).not.toMatch(/≈/);
    expect(JSON.stringify(inAwg)).not.toMatch(/⟦/);
  });

  it('writes an AWG size exactly and leaves other text alone', () => {
    expect(showSizes(`⟦size:${storedAwgAreaMm2(18)}⟧ wire, 3 ⟦mark⟧`, 'awg')).toBe(
      '18 AWG wire, 3 ⟦mark⟧',
    );
  });
});
