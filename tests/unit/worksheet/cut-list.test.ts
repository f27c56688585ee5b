import { describe, expect, it } from 'vitest';
import {
  buildCutList,
  formatMetres,
  withAllowance,
} from '#server/modules/worksheets/pdf/cut-list.ts';
import { indexPlan, pinName } from '#server/modules/worksheets/pdf/plan.ts';
import { snapshot } from '../../factories/snapshot.factory.ts';

const plan = () =>
  indexPlan(
    snapshot({
      pins: [
        { disposition: 'join', colour: 'BU', sizeMm2: 0.5, runLengthM: 1.5, destinationFeedId: 1 },
        { disposition: 'extend', colour: 'BU', sizeMm2: 0.5, runLengthM: 2 },
        { disposition: 'join', colour: 'GN', sizeMm2: 0.5, runLengthM: null, destination: 'V1-2' },
        { disposition: 'depin', colour: 'YE', runLengthM: 3 },
        { disposition: 'cut', colour: 'VT' },
        {
          disposition: 'join',
          colour: 'RD',
          sizeMm2: 0.5,
          runLengthM: 0.8,
          destination: 'Stud G1',
        },
        { disposition: 'keep', colour: 'BK', runLengthM: 5 },
      ],
      feeds: [
        {
          wire: {
            sizeMm2: 1.5,
            insulationRatingC: 105,
            lengthM: 1,
            zone: 'cabin',
            bundled: 1,
            returnPath: 'wire',
            colour: 'RD',
          },
          loads: [
            { id: 1, pinId: null, name: 'Pump', currentA: 5, continuous: true },
            { id: 2, pinId: 1, name: 'ECU', currentA: 1, continuous: true },
          ],
        },
      ],
    }),
  );

describe('wire cut list', () => {
  it('takes feed wires, their return wires and extended or joined pins with a length', () => {
    const cut = buildCutList(plan(), 15);
    const rows = cut.rows.map((r) => [r.sizeMm2, r.colour, r.pieces, Number(r.lengthM.toFixed(6))]);
    expect(rows).toEqual([
      [0.5, 'BU', 2, 3.5],
      [0.5, 'RD', 1, 0.8],
      [1.5, 'RD', 1, 1],
      [1.5, '', 1, 1],
    ]);
    expect(cut.totalLengthM).toBeCloseTo(6.3, 9);
    expect(cut.totalCutM).toBeCloseTo(6.3 * 1.15, 9);
    expect(cut.rows[0]!.cutM).toBeCloseTo(3.5 * 1.15, 9);
  });

  it('lists extended or joined pins without a length to measure, and leaves kept pins out', () => {
    const index = plan();
    const cut = buildCutList(index, 15);
    expect(cut.unmeasured.map((p) => pinName(index, p))).toEqual(['E1-3']);
    expect(cut.rows.flatMap((r) => r.parts.map((p) => p.label))).not.toContain('E1-7');
    expect(cut.rows.flatMap((r) => r.parts.map((p) => p.label))).not.toContain('E1-4');
  });

  it('counts splices, terminals, end caps and seal plugs by the stated rule', () => {
    expect(buildCutList(plan(), 15).parts).toEqual({
      // extend: 2; the feed that a pin joins: 1
      splices: 3,
      // feed fuse end 1 + device load 1 + return wire 2 + far ends of E1-3 and E1-6: 2
      terminals: 6,
      endCaps: 1,
      sealPlugs: 1,
    });
  });

  it('adds no allowance at 0 % and rounds only when printed', () => {
    expect(withAllowance(2, 0)).toBe(2);
    expect(withAllowance(2, 15)).toBeCloseTo(2.3, 12);
    expect(formatMetres(26.9100000001)).toBe('26.91');
  });
});
