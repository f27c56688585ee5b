import type { ColumnVisibilityState } from '@tanstack/react-table';
import type { SizeUnit } from '#shared/schemas/workshop.schema.ts';
import { columnHeader, PIN_COLUMNS } from '../lib/columns.ts';

/** Show or hide grid columns; the cavity always shows, it is how a row is found. */
export function ColumnMenu({
  visibility,
  onChange,
  unit,
}: {
  visibility: ColumnVisibilityState;
  onChange: (visibility: ColumnVisibilityState) => void;
  unit: SizeUnit;
}) {
  const hidden = PIN_COLUMNS.filter((id) => visibility[id] === false).length;
  return (
    <details className="relative">
      <summary className="cursor-pointer rounded-md border border-rule-strong bg-paper-raised px-3 py-1.5 text-sm font-medium text-ink hover:bg-paper-sunk">
        Columns{hidden ? ` (${hidden} hidden)` : ''}
      </summary>
      <fieldset className="absolute right-0 z-40 mt-1 w-56 rounded-md border border-rule-strong bg-paper-raised p-3 shadow-lg">
        <legend className="sr-only">Columns to show</legend>
        {PIN_COLUMNS.map((id) => (
          <label key={id} className="flex items-center gap-2 py-0.5 text-sm">
            <input
              type="checkbox"
              className="size-4 accent-ink"
              disabled={id === 'cavity'}
              checked={visibility[id] !== false}
              onChange={(e) => onChange({ ...visibility, [id]: e.target.checked })}
            />
            {columnHeader(id, unit)}
          </label>
        ))}
      </fieldset>
    </details>
  );
}
