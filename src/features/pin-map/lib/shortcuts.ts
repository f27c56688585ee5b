/** The pin grid's keys, for the Help page: each a set of keys and what it does. */
export interface Shortcut {
  keys: string[];
  does: string;
  /** Only for those who may change the pin map. */
  writes?: boolean;
}

export const GRID_SHORTCUTS: Shortcut[] = [
  { keys: ['↑', '↓', '←', '→'], does: 'Move between cells' },
  { keys: ['Tab', 'Shift+Tab'], does: 'Move to the next or previous cell' },
  { keys: ['Page Up', 'Page Down'], does: 'Move a screenful up or down' },
  { keys: ['Shift+arrows', 'Shift+click'], does: 'Mark a range of cells' },
  { keys: ['↑ on the first row'], does: 'Reach the column headings, where Enter sorts' },
  { keys: ['Ctrl+A'], does: 'Mark every cell' },
  { keys: ['Ctrl+C'], does: 'Copy the marked cells, tab-separated' },
  { keys: ['Enter', 'F2'], does: 'Edit the cell', writes: true },
  {
    keys: ['Type a letter'],
    does: 'Replace the cell; over a marked range, fill every cell of it (one undo step)',
    writes: true,
  },
  {
    keys: ['Enter in an editor'],
    does: 'Save and move down; in a list, take the highlighted choice',
    writes: true,
  },
  {
    keys: ['Tab in an editor'],
    does: 'Save and move right; in a list, take the highlighted choice',
    writes: true,
  },
  { keys: ['↑', '↓ in an editor'], does: 'Move through the choices or suggestions', writes: true },
  { keys: ['Esc'], does: 'Cancel the edit, or drop the marked range', writes: true },
  {
    keys: ['Delete', 'Backspace'],
    does: 'Empty the marked cells (choice columns keep their value)',
    writes: true,
  },
  { keys: ['Ctrl+V'], does: 'Paste a block from a spreadsheet', writes: true },
  { keys: ['Ctrl+D'], does: 'Fill down from the top cell of the range', writes: true },
  { keys: ['Ctrl+Z'], does: 'Undo the last change', writes: true },
  {
    keys: ['Space on the first column'],
    does: 'Select the row (Shift+Space or Shift+click for a range)',
    writes: true,
  },
];
