import { describe, expect, it } from 'vitest';
import type { CellContext } from '../../../src/features/pin-map/lib/cell-values.ts';
import { parseClipboardBlock } from '../../../src/features/pin-map/lib/clipboard.ts';
import {
  planClear,
  planFill,
  planFillDown,
  planPaste,
} from '../../../src/features/pin-map/lib/pin-edits.ts';
import { toPinRows } from '../../../src/features/pin-map/lib/rows.ts';
import { connector, pin } from './fixtures.ts';

const ctx: CellContext = { sizeUnit: 'mm2', destinations: [] };
const COLUMNS = ['select', 'connector', 'cavity', 'function', 'colour', 'size', 'disposition'];
const FUNCTION = COLUMNS.indexOf('function');

function grid(count = 4) {
  const pins = Array.from({ length: count }, (_, i) => pin({ id: i + 1 }));
  return toPinRows(pins, [connector()]);
}

describe('planning a paste', () => {
  it('maps each cell through its column and makes one edit per pin', () => {
    const rows = grid();
    const block = parseClipboardBlock(
      'Injector 5 drive\tbu/wh\t0.75\tkeep\r\nInjector 6 drive\tBU-RD\t0,75\tKeep as is\r\n',
    );
    const plan = planPaste(
      block,
      { rows, columns: COLUMNS, startRow: 1, startColumn: FUNCTION },
      ctx,
    );
    expect(plan).toEqual({
      ok: true,
      cellCount: 8,
      clippedRows: 0,
      clippedColumns: 0,
      edits: [
        {
          id: 2,
          set: {
            function: 'Injector 5 drive',
            colour: 'BU/WH',
            sizeMm2: 0.75,
            disposition: 'keep',
          },
        },
        {
          id: 3,
          set: {
            function: 'Injector 6 drive',
            colour: 'BU/RD',
            sizeMm2: 0.75,
            disposition: 'keep',
          },
        },
      ],
    });
  });

  it('clips the block at the last row and column of the grid', () => {
    const rows = grid(2);
    const block = [
      ['RD', '1.5', 'keep', 'past the edge'],
      ['BK', '1', 'cut', 'past the edge'],
      ['GN', '0.5', 'depin', 'past the edge'],
    ];
    const plan = planPaste(
      block,
      { rows, columns: COLUMNS, startRow: 0, startColumn: COLUMNS.indexOf('colour') },
      ctx,
    );
    expect(plan.ok).toBe(true);
    if (!plan.ok) return;
    expect(plan.edits.map((e) => e.id)).toEqual([1, 2]);
    expect(plan.clippedRows).toBe(1);
    expect(plan.clippedColumns).toBe(1);
  });

  it('refuses the whole block when any cell is bad, naming row, column and why', () => {
    const rows = grid();
    const plan = planPaste(
      [
        ['Coil feed', 'RD', '1.5'],
        ['Lamp', 'XX', '0.8'],
      ],
      { rows, columns: COLUMNS, startRow: 0, startColumn: FUNCTION },
      ctx,
    );
    expect(plan.ok).toBe(false);
    if (plan.ok) return;
    expect(plan.problems.map((p) => [p.pin, p.columnId, p.text])).toEqual([
      ['E1-2', 'colour', 'XX'],
      ['E1-2', 'size', '0.8'],
    ]);
    expect(plan.problems[0]!.message).toMatch(/IEC 60757/);
    expect(plan.problems[1]!.message).toMatch(/ISO 6722/);
  });

  it('accepts connector and cavity cells that match, so a copy of the grid pastes back', () => {
    const rows = grid();
    const ok = planPaste(
      [['E1', '1', 'Crank sensor +']],
      { rows, columns: COLUMNS, startRow: 0, startColumn: 1 },
      ctx,
    );
    expect(ok.ok && ok.edits).toEqual([{ id: 1, set: { function: 'Crank sensor +' } }]);
    const bad = planPaste(
      [['E1', '9']],
      { rows, columns: COLUMNS, startRow: 0, startColumn: 1 },
      ctx,
    );
    expect(bad.ok).toBe(false);
  });

  it('leaves out values that are already there', () => {
    const rows = toPinRows([pin({ id: 1, colour: 'RD' }), pin({ id: 2 })], [connector()]);
    const plan = planPaste(
      [['RD'], ['RD']],
      { rows, columns: COLUMNS, startRow: 0, startColumn: COLUMNS.indexOf('colour') },
      ctx,
    );
    expect(plan.ok && plan.edits).toEqual([{ id: 2, set: { colour: 'RD' } }]);
  });
});

describe('planning a fill down', () => {
  const rows = toPinRows(
    [
      pin({ id: 1, colour: 'BK', sizeMm2: 1.5, disposition: 'keep' }),
      pin({ id: 2 }),
      pin({ id: 3, colour: 'RD' }),
      pin({ id: 4 }),
    ],
    [connector()],
  );
  const colour = COLUMNS.indexOf('colour');
  const size = COLUMNS.indexOf('size');

  it('copies the top cell of each column of the range into the cells below', () => {
    const plan = planFillDown(rows, COLUMNS, { top: 0, bottom: 2, left: colour, right: size });
    expect(plan.ok && plan.edits).toEqual([
      { id: 2, set: { colour: 'BK', sizeMm2: 1.5 } },
      { id: 3, set: { colour: 'BK', sizeMm2: 1.5 } },
    ]);
  });

  it('copies from the row above when the range is one row high', () => {
    const plan = planFillDown(rows, COLUMNS, { top: 1, bottom: 1, left: colour, right: colour });
    expect(plan.ok && plan.edits).toEqual([{ id: 2, set: { colour: 'BK' } }]);
  });

  it('does nothing on the first row alone or on read-only columns', () => {
    expect(
      planFillDown(rows, COLUMNS, { top: 0, bottom: 0, left: colour, right: colour }),
    ).toMatchObject({ ok: true, edits: [] });
    expect(planFillDown(rows, COLUMNS, { top: 0, bottom: 3, left: 0, right: 2 })).toMatchObject({
      ok: true,
      edits: [],
    });
  });

  it('copies a linked destination with its link', () => {
    const linked = toPinRows(
      [
        pin({ id: 1, destinationPinId: 9 }),
        pin({ id: 2, destination: 'old text' }),
        pin({ id: 9, connectorId: 2, cavity: '3' }),
      ],
      [connector(), connector({ id: 2, label: 'V1', side: 'vehicle' })],
    );
    const cols = ['destination'];
    const plan = planFillDown(linked, cols, { top: 0, bottom: 1, left: 0, right: 0 });
    expect(plan.ok && plan.edits).toEqual([
      { id: 2, set: { destination: '', destinationPinId: 9 } },
    ]);
    const self = planFillDown(linked, cols, { top: 0, bottom: 2, left: 0, right: 0 });
    expect(self.ok).toBe(false);
  });
});

describe('planning Delete over a range', () => {
  it('empties text columns and leaves choice columns alone', () => {
    const rows = toPinRows(
      [pin({ id: 1, function: 'Lamp', colour: 'RD', disposition: 'keep' }), pin({ id: 2 })],
      [connector()],
    );
    const edits = planClear(
      rows,
      COLUMNS,
      { top: 0, bottom: 1, left: FUNCTION, right: COLUMNS.length - 1 },
      ctx,
    );
    expect(edits).toEqual([{ id: 1, set: { function: '', colour: '' } }]);
  });
});

describe('typing over a range', () => {
  const colour = COLUMNS.indexOf('colour');
  it('puts the one text, read by each column, into every editable cell of the range', () => {
    const rows = grid(3);
    const plan = planFill(
      rows,
      COLUMNS,
      { top: 0, bottom: 2, left: FUNCTION, right: colour },
      'bk',
      ctx,
    );
    expect(plan.ok && plan.edits[0]).toEqual({ id: 1, set: { function: 'bk', colour: 'BK' } });
    const fn = planFill(
      rows,
      COLUMNS,
      { top: 0, bottom: 2, left: FUNCTION, right: FUNCTION },
      'Spare',
      ctx,
    );
    expect(fn.ok && fn.edits).toEqual([1, 2, 3].map((id) => ({ id, set: { function: 'Spare' } })));
    const col = planFill(
      rows,
      COLUMNS,
      { top: 1, bottom: 2, left: colour, right: colour },
      'bk',
      ctx,
    );
    expect(col.ok && col.edits).toEqual([2, 3].map((id) => ({ id, set: { colour: 'BK' } })));
  });

  it('refuses the whole range when one cell cannot take the text', () => {
    const rows = grid(2);
    const plan = planFill(
      rows,
      COLUMNS,
      { top: 0, bottom: 1, left: colour, right: colour },
      'bluish',
      ctx,
    );
    expect(plan.ok).toBe(false);
    expect(!plan.ok && plan.problems.map((p) => p.pinId)).toEqual([1, 2]);
  });
});
