import { memo } from 'react';
import type { PinRow } from '../lib/rows.ts';

const SHOWN = 60;

/** The pins still undecided; each goes to its row in the grid. Memoised: redrawn when rows change. */
export const UndecidedList = memo(function UndecidedList({
  rows,
  onJump,
  onFilterUndecided,
}: {
  rows: readonly PinRow[];
  onJump: (pinId: number) => void;
  onFilterUndecided: () => void;
}) {
  const undecided = rows.filter((r) => r.pin.disposition === 'undecided');
  return (
    <details className="rounded-lg border border-rule bg-paper-raised px-4 py-3">
      <summary className="cursor-pointer font-semibold">
        Undecided pins <span className="font-mono">({undecided.length})</span>
      </summary>
      {undecided.length === 0 ? (
        <p className="mt-2 text-sm text-ink-soft">Every pin is decided.</p>
      ) : (
        <>
          <ul className="mt-2 flex flex-wrap gap-1.5">
            {undecided.slice(0, SHOWN).map((r) => (
              <li key={r.pin.id}>
                <button
                  type="button"
                  onClick={() => onJump(r.pin.id)}
                  className="rounded border border-rule-strong bg-paper px-2 py-1 text-left text-sm hover:border-ink-soft hover:bg-paper-sunk"
                >
                  <span className="font-mono font-semibold">{r.name}</span>
                  {r.pin.function ? (
                    <span className="ml-1.5 text-ink-soft">{r.pin.function}</span>
                  ) : null}
                </button>
              </li>
            ))}
          </ul>
          {undecided.length > SHOWN ? (
            <button
              type="button"
              onClick={onFilterUndecided}
              className="mt-2 text-sm text-ink underline decoration-rule-strong underline-offset-4"
            >
              …and {undecided.length - SHOWN} more: show only undecided pins in the grid
            </button>
          ) : null}
        </>
      )}
    </details>
  );
});
