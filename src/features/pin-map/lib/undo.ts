/**
 * The undo history of the pin grid: each entry holds, per pin, the values before and after one
 * change (a cell, a paste, a fill down, a selection edit). Undo writes the "before" values back.
 */
import type { Pin, PinChanges } from '#shared/schemas/pin-map.schema.ts';
import { valuesBefore } from './pin-cache.ts';
import type { PinEdit } from './pin-edits.ts';

export interface UndoEntry {
  id: string;
  /** What the change was, in words: "Colour of E1-5", "Paste into 6 pins". */
  what: string;
  changes: Array<{ id: number; before: PinChanges; after: PinChanges }>;
}

const UNDO_LIMIT = 100;

/** Records the values the edits are about to replace, read from the pins as the grid shows them. */
export function undoEntryFor(
  id: string,
  what: string,
  pins: ReadonlyMap<number, Pin>,
  edits: readonly PinEdit[],
): UndoEntry {
  return {
    id,
    what,
    changes: edits.flatMap((edit) => {
      const pin = pins.get(edit.id);
      if (!pin) return [];
      return [{ id: edit.id, before: valuesBefore(pin, edit.set), after: edit.set }];
    }),
  };
}

/** Adds an entry on top, dropping the oldest beyond the limit. */
export function pushUndo(stack: readonly UndoEntry[], entry: UndoEntry, limit = UNDO_LIMIT) {
  if (entry.changes.length === 0) return [...stack];
  return [...stack, entry].slice(-limit);
}

/** Removes an entry whose change never reached the server. */
export function dropUndo(stack: readonly UndoEntry[], id: string): UndoEntry[] {
  return stack.filter((e) => e.id !== id);
}

/** The newest entry and the stack without it, or null when there is nothing to undo. */
export function popUndo(
  stack: readonly UndoEntry[],
): { entry: UndoEntry; rest: UndoEntry[] } | null {
  const entry = stack.at(-1);
  return entry ? { entry, rest: stack.slice(0, -1) } : null;
}

/** The edits that put the previous values back. */
export function undoEdits(entry: UndoEntry): PinEdit[] {
  return entry.changes.map((c) => ({ id: c.id, set: c.before }));
}
