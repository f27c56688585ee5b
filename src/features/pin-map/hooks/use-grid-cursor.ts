import { useState } from 'react';
import { rangeBetween, type GridPosition } from '../lib/navigation.ts';
import type { CellRange } from '../lib/pin-edits.ts';
import type { PinRow } from '../lib/rows.ts';

export interface CellKey {
  pinId: number;
  columnId: string;
}

/**
 * The focused cell and the far corner of the marked range. Kept by pin and column, not by
 * position, so both stay on the same cell when rows are sorted, filtered or hidden.
 */
export function useGridCursor({
  rows,
  columnIds,
  rowIndexOf,
}: {
  rows: PinRow[];
  columnIds: string[];
  rowIndexOf: Map<number, number>;
}) {
  const [active, setActive] = useState<CellKey | null>(null);
  const [anchor, setAnchor] = useState<CellKey | null>(null);

  const positionOf = (key: CellKey | null): GridPosition | null => {
    if (!key) return null;
    const row = rowIndexOf.get(key.pinId);
    const column = columnIds.indexOf(key.columnId);
    return row === undefined || column < 0 ? null : { row, column };
  };
  const activePos = positionOf(active);
  const anchorPos = positionOf(anchor);
  const range: CellRange | null =
    activePos && anchorPos ? rangeBetween(anchorPos, activePos) : null;

  const keyAt = (pos: GridPosition): CellKey | null => {
    const row = rows[pos.row];
    const columnId = columnIds[pos.column];
    return row && columnId ? { pinId: row.pin.id, columnId } : null;
  };

  /** Where the focus starts: the first row's function cell. */
  const defaultPosition = (): GridPosition => ({
    row: 0,
    column: Math.max(0, columnIds.indexOf('function')),
  });

  /** The marked range, or the focused cell alone. */
  const currentRange = (): CellRange | null =>
    range ?? (activePos ? rangeBetween(activePos, activePos) : null);

  return {
    active,
    setActive,
    anchor,
    setAnchor,
    activePos,
    range,
    keyAt,
    defaultPosition,
    currentRange,
  };
}
