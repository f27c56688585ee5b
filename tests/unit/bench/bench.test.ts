import { describe, expect, it } from 'vitest';
import {
  benchPlanItems,
  carryOver,
  continuityLooksHigh,
  expectedContinuityOhm,
  isDone,
  isTested,
  type CarryRecord,
} from '#shared/domain/bench.ts';
import { snapshot } from '../../factories/snapshot.factory.ts';

describe('continuity readings', () => {
  it('expects the wire’s own resistance from size and run length', () => {
    // 0.017241 Ω·mm²/m × 2 m / 0.5 mm² = 0.0690 Ω at 20 °C (IEC 60028 / IACS copper) [C].
    expect(expectedContinuityOhm({ sizeMm2: 0.5, runLengthM: 2 })).toBeCloseTo(0.06896, 4);
    // The same wire at 40 °C: × (1 + 0.00393 × 20) = 1.0786 (IACS α₂₀) [C].
    expect(expectedContinuityOhm({ sizeMm2: 0.5, runLengthM: 2 }, 40)).toBeCloseTo(0.07438, 4);
    expect(expectedContinuityOhm({ sizeMm2: null, runLengthM: 2 })).toBeNull();
    expect(expectedContinuityOhm({ sizeMm2: 0.5, runLengthM: null })).toBeNull();
  });

  it('flags a reading above the wire plus 0.2 Ω (common practice, no source)', () => {
    expect(continuityLooksHigh(0.15, null)).toBe(false);
    expect(continuityLooksHigh(0.25, null)).toBe(true);
    expect(continuityLooksHigh(0.25, 0.069)).toBe(false);
    expect(continuityLooksHigh(0.3, 0.069)).toBe(true);
  });
});

describe('bench items', () => {
  it('puts de-pin first, then cut, extend, join, keep, leaves out empty cavities, then the feeds', () => {
    const s = snapshot({
      pins: [
        { disposition: 'keep' },
        { disposition: 'join' },
        { disposition: 'empty' },
        { disposition: 'depin' },
        { disposition: 'cut' },
        { disposition: 'extend' },
      ],
      feeds: [{ name: 'Fan' }],
    });
    expect(benchPlanItems(s).map((i) => i.pin?.disposition ?? i.name)).toEqual([
      'depin',
      'cut',
      'extend',
      'join',
      'keep',
      'Feed: Fan',
    ]);
  });

  it('offers only ticks that make sense: no reading for a wire that goes, fuse and relay for a feed', () => {
    const s = snapshot({
      pins: [{ disposition: 'depin' }, { disposition: 'cut' }, { disposition: 'join' }],
      feeds: [{ fuseA: 20, relay: { contactRatingA: 30, coilCurrentA: 0.15, coilPinId: null } }],
    });
    const [depin, cut, join, feed] = benchPlanItems(s);
    expect(depin!.ticks.map((t) => t.label)).toEqual(['Terminal out', 'Cavity sealed/plugged']);
    expect(depin!.reading).toBeNull();
    expect(cut!.ticks.map((t) => t.label)).toEqual(['Cut back', 'End insulated']);
    expect(cut!.reading).toBeNull();
    expect(join!.ticks.map((t) => t.key)).toEqual(['done', 'tested']);
    expect(join!.reading).not.toBeNull();
    expect(feed!.ticks.map((t) => t.label)).toEqual([
      'Wired',
      'Fuse fitted, 20 A',
      'Relay fitted',
      'Tested',
    ]);
    expect(isDone(depin!, { done: true })).toBe(false);
    expect(isDone(depin!, { done: true, sealed: true })).toBe(true);
    expect(isTested(depin!, { tested: true })).toBe(false);
    expect(isDone(join!, { done: true })).toBe(true);
  });
});

describe('carrying bench work to a new revision', () => {
  const rev1 = snapshot({
    pins: [
      { disposition: 'join', runLengthM: 1 }, // E1-1 unchanged
      { disposition: 'cut' }, // E1-2 changed to de-pin
      { disposition: 'join', runLengthM: 2 }, // E1-3 unchanged, nothing recorded
      { disposition: 'extend', runLengthM: 1 }, // E1-4 becomes empty: removed
    ],
  });
  const rev2 = snapshot({
    pins: [
      { disposition: 'join', runLengthM: 1 },
      { disposition: 'depin' },
      { disposition: 'join', runLengthM: 2 },
      { disposition: 'empty' },
      { disposition: 'join', runLengthM: 3 }, // E1-5 added
    ],
  });
  const rec = (key: string, ticks: CarryRecord['ticks'], reading: number | null = null) => ({
    key,
    ticks,
    reading,
    note: '',
    rework: null,
  });
  const records: CarryRecord[] = [
    rec('pin:E1-1', { done: true, tested: true }, 0.05),
    rec('pin:E1-2', { done: true, insulated: true }),
    rec('pin:E1-4', { done: true }),
  ];

  it('carries unchanged items, reworks changed ones with what was done, lists removed and added', async () => {
    const out = await carryOver(
      { number: 1, items: benchPlanItems(rev1), records },
      { items: benchPlanItems(rev2) },
    );
    expect(out.carried.map((c) => c.key)).toEqual(['pin:E1-1']);
    expect(out.carried[0]).toMatchObject({ ticks: { done: true, tested: true }, reading: 0.05 });
    expect(out.rework).toHaveLength(1);
    expect(out.rework[0]!.key).toBe('pin:E1-2');
    expect(out.rework[0]!.rework.was).toBe('Cut and insulate (cut back, end insulated)');
    expect(out.removed.map((r) => r.key)).toEqual(['pin:E1-4']);
    expect(out.removed[0]!.rework.removed).toBe(true);
    expect(out.added).toEqual(['pin:E1-5']);
  });

  it('treats a size change as a change of the row, and a renumbered id as the same cavity', async () => {
    const resized = snapshot({ pins: [{ disposition: 'join', runLengthM: 1, sizeMm2: 1 }] });
    const renumbered = snapshot({ pins: [{ disposition: 'join', runLengthM: 1 }] });
    renumbered.pins[0]!.id = 77;
    const from = { number: 1, items: benchPlanItems(rev1), records: records.slice(0, 1) };
    expect((await carryOver(from, { items: benchPlanItems(resized) })).rework).toHaveLength(1);
    expect((await carryOver(from, { items: benchPlanItems(renumbered) })).carried).toHaveLength(1);
  });

  it('keeps rework owed through a further revision until it is done', async () => {
    const owed = {
      ...rec('pin:E1-2', {}),
      rework: { fromRevision: 1, name: 'E1-2', was: 'Cut and insulate (cut back)', removed: false },
    };
    const rev3 = snapshot({ pins: [{ disposition: 'join' }, { disposition: 'keep' }] });
    const out = await carryOver(
      { number: 2, items: benchPlanItems(rev2), records: [owed] },
      { items: benchPlanItems(rev3) },
    );
    expect(out.rework).toEqual([{ key: 'pin:E1-2', rework: { ...owed.rework } }]);
    const unchanged = await carryOver(
      { number: 2, items: benchPlanItems(rev2), records: [owed] },
      { items: benchPlanItems(rev2) },
    );
    expect(unchanged.carried[0]!.rework).toEqual(owed.rework);
  });
});
