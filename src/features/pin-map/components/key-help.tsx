/** The grid's keys, said under it and referenced by the grid's aria-describedby. */
function Key({ children }: { children: string }) {
  return (
    <kbd className="rounded border border-rule-strong bg-paper-raised px-1 font-mono text-[0.75rem]">
      {children}
    </kbd>
  );
}

export function KeyHelp({ readOnly }: { readOnly: boolean }) {
  return (
    <p id="pin-grid-keys" className="text-xs leading-relaxed text-ink-faint">
      <Key>↑</Key> <Key>↓</Key> <Key>←</Key> <Key>→</Key> and <Key>Tab</Key> move · <Key>Shift</Key>
      +arrows or Shift+click mark cells · <Key>↑</Key> from the first row reaches the headings,
      where <Key>Enter</Key> sorts · <Key>Ctrl</Key>+<Key>C</Key> copies
      {readOnly ? null : (
        <>
          {' '}
          · <Key>Enter</Key> or <Key>F2</Key> edits, or just type · <Key>Esc</Key> cancels ·{' '}
          <Key>Delete</Key> empties · <Key>Ctrl</Key>+<Key>V</Key> pastes a block from a spreadsheet
          · <Key>Ctrl</Key>+<Key>D</Key> fills down · <Key>Ctrl</Key>+<Key>Z</Key> undoes ·{' '}
          <Key>Space</Key> on the first column selects the row
        </>
      )}
    </p>
  );
}
