import { describe, expect, it } from 'vitest';
import { storedAwgAreaMm2 } from '../../../shared/domain/wire-sizes.ts';
import { parseCell, type CellContext } from '../../../src/features/pin-map/lib/cell-values.ts';
import { cellText } from '../../../src/features/pin-map/lib/columns.ts';
import { changedFields } from '../../../src/features/pin-map/lib/pin-edits.ts';
import type { PinRow } from '../../../src/features/pin-map/lib/rows.ts';
import { pin } from '../pin-map/fixtures.ts';

const row = (sizeMm2: number): PinRow => ({
  pin: pin({ id: 5, sizeMm2 }),
  name: 'E1-5',
  connectorLabel: 'E1',
  linkedDestination: '',
});

/** Opening a size cell and pressing Enter without typing: what the grid does with the shown text. */
function enterUnchanged(sizeMm2: number, sizeUnit: CellContext['sizeUnit']) {
  const r = row(sizeMm2);
  const ctx: CellContext = { sizeUnit, destinations: [] };
  const parsed = parseCell('size', cellText(r, 'size', sizeUnit), ctx, r.pin.id);
  return parsed.ok ? changedFields(r.pin, parsed.set) : parsed.error;
}

describe('a size cell opened and left unchanged', () => {
  it('keeps a 4 mm² pin at 4 mm² in an AWG workshop (it used to become 11 AWG, 4.1723 mm²)', () => {
    expect(enterUnchanged(4, 'awg')).toEqual({});
  });

  it('keeps an 18 AWG pin in a metric workshop (it used to refuse "0.823 mm²")', () => {
    expect(enterUnchanged(storedAwgAreaMm2(18), 'mm2')).toEqual({});
  });
});
