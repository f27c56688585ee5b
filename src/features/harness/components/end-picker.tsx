import { useId, useMemo, useState, type KeyboardEvent } from 'react';
import type { WireEnd } from '#shared/schemas/harness.schema.ts';
import { matchEnds, type EndOption } from '../lib/end-options.ts';

interface EndPickerProps {
  options: readonly EndOption[];
  /** The accessible name: "End A of W-004". */
  label: string;
  initialText?: string;
  onPick: (end: WireEnd, how: 'enter' | 'tab' | 'click') => void;
  onCancel: () => void;
  autoFocus?: boolean;
  className?: string;
}

/**
 * A type-ahead of every place an end can go: cavities, splices, ground points, box terminals and
 * sources, with the typed text as a loose end last. Typing highlights the first match; Enter, Tab
 * or a click takes the highlighted one. Nobody types an id.
 */
export function EndPicker({
  options,
  label,
  initialText = '',
  onPick,
  onCancel,
  autoFocus = true,
  className = '',
}: EndPickerProps) {
  const [text, setText] = useState(initialText);
  const [active, setActive] = useState(0);
  const [focused, setFocused] = useState(autoFocus);
  const listId = useId();
  const matches = useMemo(() => matchEnds(options, text), [options, text]);
  const current = matches[Math.min(active, matches.length - 1)];

  const onKeyDown = (e: KeyboardEvent<HTMLInputElement>) => {
    if (e.key === 'ArrowDown') {
      e.preventDefault();
      setActive((i) => Math.min(i + 1, matches.length - 1));
    } else if (e.key === 'ArrowUp') {
      e.preventDefault();
      setActive((i) => Math.max(i - 1, 0));
    } else if (e.key === 'Enter' || e.key === 'Tab') {
      if (!current || !text.trim()) {
        if (e.key === 'Enter') e.preventDefault();
        onCancel();
        return;
      }
      e.preventDefault();
      onPick(current.end, e.key === 'Enter' ? 'enter' : 'tab');
    } else if (e.key === 'Escape') {
      e.preventDefault();
      e.stopPropagation();
      onCancel();
    }
  };

  return (
    <div className={`relative ${className}`}>
      <input
        role="combobox"
        aria-label={label}
        aria-expanded={focused && matches.length > 0}
        aria-controls={listId}
        aria-autocomplete="list"
        aria-activedescendant={current ? `${listId}-${current.key}` : undefined}
        // The grid focuses its editor on purpose: typing in a cell starts this picker.
        autoFocus={autoFocus}
        value={text}
        placeholder="Cavity, splice, ground, relay, fuse…"
        onChange={(e) => {
          setText(e.target.value);
          setActive(0);
        }}
        onKeyDown={onKeyDown}
        onFocus={() => setFocused(true)}
        onBlur={() => {
          setFocused(false);
          onCancel();
        }}
        className="w-full rounded border border-copper bg-paper-raised px-2 py-1 text-sm"
      />
      {focused && matches.length > 0 ? (
        <ul
          id={listId}
          role="listbox"
          aria-label={`Places for ${label}`}
          className="absolute left-0 top-full z-30 mt-1 max-h-72 w-80 overflow-y-auto rounded-md border border-rule-strong bg-paper-raised py-1 text-sm shadow-lg"
        >
          {matches.map((o, i) => (
            <li
              key={o.key}
              id={`${listId}-${o.key}`}
              role="option"
              aria-selected={o === current}
              // mousedown, not click: the input's blur would close the list first.
              onMouseDown={(e) => {
                e.preventDefault();
                onPick(o.end, 'click');
              }}
              onMouseEnter={() => setActive(i)}
              className={`cursor-pointer px-2 py-1 ${o === current ? 'bg-copper/15' : ''} ${
                o.end.kind === 'unresolved' ? 'border-t border-rule italic text-ink-soft' : ''
              }`}
            >
              <span className="font-mono font-medium">{o.label}</span>
              {o.detail ? <span className="ml-1.5 text-ink-soft"> {o.detail}</span> : null}
            </li>
          ))}
        </ul>
      ) : null}
    </div>
  );
}
