import { describe, expect, it } from 'vitest';
import { buildTestPlan, judgeStep } from '#shared/domain/test-plan.ts';
import { snapshot } from '../../factories/snapshot.factory.ts';

const plan = buildTestPlan(
  snapshot({
    pins: [
      { disposition: 'join', runLengthM: 2, sizeMm2: 0.5, signalClass: 'power_feed' },
      { disposition: 'extend', runLengthM: 1, sizeMm2: 1, signalClass: 'power_ground' },
      { disposition: 'keep', signalClass: 'sensor_reference', function: '5 V reference' },
      { disposition: 'keep', signalClass: 'communication', function: 'CAN high' },
      { disposition: 'keep', signalClass: 'communication', function: 'CAN low' },
      { disposition: 'depin', signalClass: 'power_feed' },
    ],
    feeds: [
      {
        name: 'Fan',
        relay: { contactRatingA: 40, coilCurrentA: 0.15, coilPinId: null },
        wire: {
          sizeMm2: 4,
          insulationRatingC: 105,
          lengthM: 3,
          zone: 'engine_bay',
          bundled: 1,
          returnPath: 'wire',
          colour: '',
        },
      },
    ],
  }),
);
const step = (key: string) => plan.steps.find((s) => s.key === key)!;

describe('test plan', () => {
  it('gives every wire its expected resistance and the pass limit', () => {
    // 0.017241 × 2 / 0.5 = 0.0690 Ω at 20 °C (IEC 60028 / IACS copper) [C]; limit + 0.2 Ω
    // (common practice, no source).
    expect(step('pin:E1-1')).toMatchObject({ phase: 'unplugged', unit: 'Ω' });
    expect(step('pin:E1-1').expected).toBeCloseTo(0.06896, 4);
    expect(step('pin:E1-1').limit!.max).toBeCloseTo(0.26896, 4);
    // 0.017241 × 3 / 4 = 0.01293 Ω [C].
    expect(step('feed:1').expected).toBeCloseTo(0.01293, 4);
    const wires = plan.steps.filter((s) => s.phase === 'unplugged' && s.unit === 'Ω');
    expect(wires.map((s) => s.key)).toEqual(['pin:E1-2', 'pin:E1-1', 'feed:1']);
  });

  it('checks shorts to ground and to neighbouring cavities, and insulates each feed', () => {
    expect(step('test:short-ground:pin:E1-1').unit).toBe('check');
    expect(step('test:short-neighbour:pin:E1-1').what).toContain('E1-2');
    expect(step('test:insulation:feed:1').limit).toEqual({ min: 1, max: null });
  });

  it('measures ECU power pins, power grounds, the 5 V reference, the CAN pair and each relay', () => {
    // The de-pinned power pin is not measured.
    expect(plan.steps.filter((s) => s.key.startsWith('test:volts:')).map((s) => s.key)).toEqual([
      'test:volts:E1-1',
    ]);
    expect(step('test:ground-drop:E1-2').limit!.max).toBe(0.1);
    expect(step('test:reference:E1-3').limit).toEqual({ min: 4.9, max: 5.1 });
    // ISO 11898-2: two 120 Ω terminations in parallel = 60 Ω [V, references.md].
    expect(step('test:can:E1-4/E1-5').expected).toBe(60);
    expect(step('test:relay:feed:1').unit).toBe('check');
    expect(plan.steps.filter((s) => s.phase === 'first_start')).toHaveLength(4);
  });

  it('judges each reading at once', () => {
    const wire = step('pin:E1-1');
    expect(judgeStep(wire, { reading: 0.2 }, null)).toBe('pass');
    expect(judgeStep(wire, { reading: 0.3 }, null)).toBe('fail');
    expect(judgeStep(wire, { reading: null }, null)).toBe('unknown');
    // Within 0.5 V of a 12.6 V battery (common practice, no source).
    const power = step('test:volts:E1-1');
    expect(judgeStep(power, { reading: 12.2 }, 12.6)).toBe('pass');
    expect(judgeStep(power, { reading: 12.0 }, 12.6)).toBe('fail');
    expect(judgeStep(power, { reading: 12.2 }, null)).toBe('unknown');
    const can = step('test:can:E1-4/E1-5');
    expect(judgeStep(can, { reading: 120 }, null)).toBe('fail');
    expect(judgeStep(can, { reading: 61 }, null)).toBe('pass');
    const relay = step('test:relay:feed:1');
    expect(judgeStep(relay, { reading: null, failed: true }, null)).toBe('fail');
    expect(judgeStep(relay, { reading: null, passed: true }, null)).toBe('pass');
  });
});
