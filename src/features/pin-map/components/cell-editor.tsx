import { useEffect, useLayoutEffect, useRef, useState, type KeyboardEvent } from 'react';
import type { EditorKind, EditorOption } from '../lib/editor-options.ts';
import { DispositionGlyph } from '@/components/ui/disposition-glyph.tsx';
import { ColourSwatch } from '@/components/ui/wire-colour.tsx';

export type EditorMove = 'down' | 'up' | 'right' | 'left' | 'stay';

export interface CellEditorProps {
  id: string;
  /** "Colour of E1-5", read out for the input. */
  label: string;
  kind: EditorKind;
  /** The least width of the editor and its list, for lists wider than their column. */
  listWidth: number;
  initialText: string;
  /** Opened by typing a character: the text is new, the caret goes to its end. */
  fresh: boolean;
  options: (text: string) => EditorOption[];
  width: number;
  /** Open the list above the cell (near the bottom of the grid). */
  dropUp: boolean;
  /** Saves the text; returns why it cannot be saved, or null when it was taken. */
  onCommit: (text: string, move: EditorMove) => string | null;
  onCancel: () => void;
  /** Focus left the editor: keep what can be kept. */
  onLeave: (text: string | null) => void;
}

/**
 * The editor of one grid cell: a text box, with a list of choices or suggestions for columns that
 * have them. Enter saves and moves down, Tab saves and moves sideways, Escape puts the value back.
 * In a type-ahead, both save the highlighted suggestion, not the letters typed so far.
 */
export function CellEditor({
  id,
  label,
  kind,
  listWidth,
  initialText,
  fresh,
  options,
  width,
  dropUp,
  onCommit,
  onCancel,
  onLeave,
}: CellEditorProps) {
  const [text, setText] = useState(initialText);
  // Until the person types, a choice list shows every choice with the current one marked.
  const [filtering, setFiltering] = useState(fresh);
  const [error, setError] = useState<string | null>(null);
  const list = kind === 'text' ? [] : options(filtering ? text : '');
  const currentIndex = list.findIndex((o) => o.commit === initialText);
  // A type-ahead opened by typing starts on its first suggestion, as it does after each keystroke.
  const [highlight, setHighlight] = useState(() =>
    kind === 'choice'
      ? Math.max(0, fresh ? 0 : currentIndex)
      : kind === 'typeahead' && fresh && initialText.trim()
        ? 0
        : -1,
  );
  const inputRef = useRef<HTMLInputElement>(null);
  const finished = useRef(false);

  useLayoutEffect(() => {
    const input = inputRef.current;
    if (!input) return;
    input.focus({ preventScroll: true });
    if (fresh) input.setSelectionRange(input.value.length, input.value.length);
    else input.select();
  }, [fresh]);

  useEffect(() => {
    if (highlight >= 0)
      document.getElementById(`${id}-opt-${highlight}`)?.scrollIntoView({ block: 'nearest' });
  }, [highlight, id]);

  function commit(value: string, move: EditorMove) {
    // Saving hands the focus back to the grid, which blurs this input: that blur must not save again.
    finished.current = true;
    const problem = onCommit(value, move);
    if (problem) {
      finished.current = false;
      setError(problem);
    }
  }

  function chosen(): string | null {
    const option = highlight >= 0 ? list[highlight] : undefined;
    if (option) return option.commit;
    if (kind === 'choice') return null;
    return text;
  }

  function onKeyDown(event: KeyboardEvent<HTMLInputElement>) {
    // The grid's own keys must not fire while a cell is being edited.
    event.stopPropagation();
    const { key, shiftKey } = event;
    if (key === 'Escape') {
      event.preventDefault();
      finished.current = true;
      onCancel();
    } else if (key === 'Enter' || key === 'Tab') {
      event.preventDefault();
      const value = chosen();
      const move: EditorMove =
        key === 'Tab' ? (shiftKey ? 'left' : 'right') : shiftKey ? 'up' : 'down';
      if (value === null) setError('choose one of the list');
      else commit(value, move);
    } else if ((key === 'ArrowDown' || key === 'ArrowUp') && list.length > 0) {
      event.preventDefault();
      const step = key === 'ArrowDown' ? 1 : -1;
      setHighlight((h) =>
        Math.min(list.length - 1, Math.max(kind === 'choice' ? 0 : -1, h + step)),
      );
    }
  }

  function onBlur() {
    if (finished.current) return;
    finished.current = true;
    if (kind === 'choice') onLeave(filtering ? chosen() : null);
    else if (kind === 'typeahead') onLeave(filtering ? chosen() : null);
    else onLeave(text === initialText && !fresh ? null : text);
  }

  const listId = `${id}-list`;
  const errorId = `${id}-error`;
  const activeOption = highlight >= 0 && list[highlight] ? `${id}-opt-${highlight}` : undefined;

  return (
    <div className="absolute left-0 top-0 z-30" style={{ width: Math.max(width, listWidth) }}>
      <input
        ref={inputRef}
        id={id}
        value={text}
        aria-label={label}
        role={kind === 'text' ? undefined : 'combobox'}
        aria-autocomplete={kind === 'text' ? undefined : 'list'}
        aria-expanded={kind === 'text' ? undefined : list.length > 0}
        aria-controls={list.length ? listId : undefined}
        aria-activedescendant={activeOption}
        aria-invalid={error ? true : undefined}
        aria-describedby={error ? errorId : undefined}
        autoComplete="off"
        spellCheck={false}
        onChange={(e) => {
          setText(e.target.value);
          setFiltering(true);
          setError(null);
          setHighlight(
            kind === 'choice' || (kind === 'typeahead' && e.target.value.trim()) ? 0 : -1,
          );
        }}
        onKeyDown={onKeyDown}
        onBlur={onBlur}
        className="h-10 w-full rounded-none border-2 border-focus bg-paper-raised px-2 text-[0.875rem] text-ink outline-none aria-[invalid=true]:border-fault"
      />
      {error ? (
        <p
          id={errorId}
          role="alert"
          className="border-x-2 border-b-2 border-fault bg-fault-wash px-2 py-1 text-xs text-fault"
        >
          <span aria-hidden>✕ </span>
          {error}
        </p>
      ) : null}
      {list.length ? (
        <ul
          id={listId}
          role="listbox"
          aria-label={`${label}: choices`}
          className={`absolute left-0 max-h-64 w-full overflow-auto rounded-md border border-rule-strong bg-paper-raised py-1 shadow-lg ${dropUp ? 'bottom-full mb-1' : 'top-full mt-1'}`}
        >
          {list.map((option, i) => (
            <li
              key={option.key}
              id={`${id}-opt-${i}`}
              role="option"
              aria-selected={i === highlight}
              onMouseDown={(e) => e.preventDefault()}
              onClick={() => commit(option.commit, 'stay')}
              className={`flex cursor-pointer items-center gap-2 px-2 py-1.5 text-sm ${i === highlight ? 'bg-[color-mix(in_srgb,var(--color-focus)_14%,var(--color-paper-raised))] text-ink' : 'text-ink-soft hover:bg-paper-sunk'}`}
            >
              {option.disposition ? <DispositionGlyph disposition={option.disposition} /> : null}
              {option.colour ? <ColourSwatch value={option.colour} /> : null}
              <span
                className={`shrink-0 whitespace-nowrap ${kind === 'choice' ? '' : 'font-mono'}`}
              >
                {option.label}
              </span>
              {option.hint ? (
                <span className="truncate text-xs text-ink-faint">{option.hint}</span>
              ) : null}
              {option.commit === initialText && !fresh && kind === 'choice' ? (
                <span className="ml-auto text-xs text-ink-faint">current</span>
              ) : null}
            </li>
          ))}
        </ul>
      ) : null}
    </div>
  );
}
