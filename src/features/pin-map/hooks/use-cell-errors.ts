import { useState } from 'react';
import type { CellError } from '../components/grid-row.tsx';
import type { CellProblem } from '../lib/pin-edits.ts';

type ErrorsByPin = Map<number, Map<string, CellError>>;

/** The cells that did not take their text: shown in red with the text kept, until fixed. */
export function useCellErrors() {
  const [cellErrors, setCellErrors] = useState<ErrorsByPin>(() => new Map());

  /** Replaces every mark with these problems. */
  function show(problems: CellProblem[]) {
    const next: ErrorsByPin = new Map();
    for (const p of problems) {
      const row = new Map(next.get(p.pinId));
      row.set(p.columnId, { text: p.text, message: p.message });
      next.set(p.pinId, row);
    }
    setCellErrors(next);
  }

  function add(pinId: number, columnId: string, error: CellError) {
    setCellErrors((old) => {
      const next = new Map(old);
      next.set(pinId, new Map(next.get(pinId)).set(columnId, error));
      return next;
    });
  }

  function clear(pinId: number, columnId: string) {
    if (!cellErrors.get(pinId)?.has(columnId)) return;
    setCellErrors((old) => {
      const next = new Map(old);
      const row = new Map(next.get(pinId));
      row.delete(columnId);
      if (row.size) next.set(pinId, row);
      else next.delete(pinId);
      return next;
    });
  }

  return {
    forPin: (pinId: number) => cellErrors.get(pinId),
    show,
    add,
    clear,
    clearAll: () => setCellErrors(new Map()),
  };
}

export type CellErrors = ReturnType<typeof useCellErrors>;
