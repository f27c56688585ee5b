import { useState, type KeyboardEvent } from 'react';
import type { Wire, WireEnd } from '#shared/schemas/harness.schema.ts';
import { WireColour } from '@/components/ui/wire-colour.tsx';
import { endText, type EndOption } from '../lib/end-options.ts';
import {
  WIRE_COLUMN_HEADERS,
  ZONE_CHOICES,
  cellText,
  zoneLabel,
  type WireColumnId,
} from '../lib/wire-cells.ts';
import { EndPicker } from './end-picker.tsx';

/** How an edit ended, so the grid knows where the cursor goes next. */
export type Leave = 'down' | 'right' | 'left' | 'stay';

export function CellValue({
  wire,
  col,
  byKey,
}: {
  wire: Wire;
  col: WireColumnId;
  byKey: ReadonlyMap<string, EndOption>;
}) {
  switch (col) {
    case 'label':
      return <span className="font-mono font-medium">{wire.label}</span>;
    case 'colour':
      return <WireColour value={wire.colour} />;
    case 'size':
      return <span className="font-mono">{wire.sizeMm2 ?? '—'}</span>;
    case 'length':
      return <span className="font-mono">{wire.lengthM ?? '—'}</span>;
    case 'zone':
      return <span className="whitespace-nowrap">{zoneLabel(wire.zone)}</span>;
    case 'notes':
      return <span className="text-ink-soft">{wire.notes}</span>;
    case 'twist':
      return <span className="font-mono">{wire.twistGroup || '—'}</span>;
    case 'shielded':
      return <span>{wire.shielded ? 'yes' : 'no'}</span>;
    case 'endA':
    case 'endB': {
      const end = wire.ends[col === 'endA' ? 0 : 1];
      return (
        <span className={end.kind === 'unresolved' ? 'italic text-caution' : ''}>
          {endText(end, byKey)}
        </span>
      );
    }
  }
}

interface CellEditorProps {
  wire: Wire;
  col: WireColumnId;
  seed: string | null;
  options: readonly EndOption[];
  onText: (text: string, leave: Leave) => void;
  onEnd: (end: WireEnd, leave: Leave) => void;
  onCancel: () => void;
}

const EDITOR = 'w-full rounded border border-copper bg-paper-raised px-2 py-1 text-sm outline-none';

/** The editor inside a cell: a text box, the zone list or the end type-ahead. */
export function CellEditor({ wire, col, seed, options, onText, onEnd, onCancel }: CellEditorProps) {
  const [text, setText] = useState(seed ?? cellText(wire, col));
  const name = `${WIRE_COLUMN_HEADERS[col]} of ${wire.label}`;

  if (col === 'endA' || col === 'endB') {
    return (
      <EndPicker
        options={options}
        label={name}
        initialText={seed ?? ''}
        onPick={(end, how) => onEnd(end, how === 'tab' ? 'right' : 'stay')}
        onCancel={onCancel}
      />
    );
  }
  if (col === 'zone') {
    return (
      <select
        aria-label={name}
        autoFocus
        defaultValue={wire.zone}
        onChange={(e) => onText(e.target.value, 'stay')}
        onKeyDown={(e) => {
          if (e.key === 'Escape') onCancel();
          if (e.key === 'Enter') onText(e.currentTarget.value, 'down');
        }}
        onBlur={onCancel}
        className={EDITOR}
      >
        {ZONE_CHOICES.map((z) => (
          <option key={z} value={z}>
            {zoneLabel(z)}
          </option>
        ))}
      </select>
    );
  }
  const onKeyDown = (e: KeyboardEvent<HTMLInputElement>) => {
    if (e.key === 'Enter') {
      e.preventDefault();
      onText(text, 'down');
    } else if (e.key === 'Tab') {
      e.preventDefault();
      onText(text, e.shiftKey ? 'left' : 'right');
    } else if (e.key === 'Escape') {
      e.preventDefault();
      onCancel();
    }
  };
  return (
    <input
      aria-label={name}
      autoFocus
      value={text}
      onChange={(e) => setText(e.target.value)}
      onKeyDown={onKeyDown}
      onBlur={() => onText(text, 'stay')}
      className={EDITOR}
    />
  );
}
