import {
  COLUMN_TARGETS,
  IGNORE,
  IMPORT_FIELD_LABELS,
  type ColumnMapping,
  type ColumnTarget,
  type ImportChange,
  type PreviewPage,
} from '#shared/schemas/imports.schema.ts';
import { Button } from '@/components/ui/button.tsx';
import { cellKey, plural, type PreviewIndex } from '../lib/preview.ts';

function targetLabel(target: ColumnTarget): string {
  return target === IGNORE ? 'Not imported' : (IMPORT_FIELD_LABELS[target] ?? target);
}

/** A problem told in words and a glyph, never by colour alone. */
function Problem({ message }: { message: string }) {
  return (
    <p className="mt-1 flex gap-1 text-xs leading-snug text-fault">
      <span aria-hidden className="font-bold">
        ✕
      </span>
      <span>
        <strong className="font-semibold">Problem:</strong> {message}
      </span>
    </p>
  );
}

function ChangeCell({
  change,
  refused,
  planned,
}: {
  change: ImportChange | undefined;
  refused: boolean;
  planned: boolean;
}) {
  if (refused) {
    return (
      <span className="font-medium whitespace-nowrap text-fault">
        <span aria-hidden>✕ </span>Not imported
      </span>
    );
  }
  if (!planned) return <span className="text-ink-faint">—</span>;
  if (!change) {
    return (
      <span className="whitespace-nowrap text-ink-faint">
        <span aria-hidden>= </span>No change
      </span>
    );
  }
  if (change.kind === 'add') {
    return (
      <span className="font-medium whitespace-nowrap text-sound">
        <span aria-hidden>+ </span>New cavity
      </span>
    );
  }
  if (change.kind === 'change') {
    return (
      <span className="text-ink">
        <span aria-hidden className="text-copper">
          ✎{' '}
        </span>
        Changes {change.fields.map((f) => f.label.toLowerCase()).join(', ')}
      </span>
    );
  }
  return null;
}

/**
 * Which page of the file's lines the preview shows, the way to the others, and straight to the
 * pages that hold problems.
 */
export function PreviewPager({
  page,
  lines,
  busy,
  onPage,
}: {
  page: PreviewPage;
  /** Lines of the file (data rows). */
  lines: number;
  busy?: boolean;
  onPage: (page: number) => void;
}) {
  if (page.count <= 1) return null;
  const first = (page.number - 1) * page.size + 1;
  const last = Math.min(page.number * page.size, lines);
  const problemPages = page.withProblems.filter((p) => p !== page.number);
  return (
    <nav
      aria-label="Pages of the file"
      className="flex flex-wrap items-center gap-x-3 gap-y-2 text-sm text-ink-soft"
    >
      <span>
        Rows {first.toLocaleString('en')}–{last.toLocaleString('en')} of {plural(lines, 'row')}{' '}
        (page {page.number} of {page.count})
      </span>
      <Button size="sm" disabled={busy || page.number <= 1} onClick={() => onPage(page.number - 1)}>
        Previous page
      </Button>
      <Button
        size="sm"
        disabled={busy || page.number >= page.count}
        onClick={() => onPage(page.number + 1)}
      >
        Next page
      </Button>
      {problemPages.length ? (
        <span className="flex flex-wrap items-center gap-1.5">
          <span className="text-fault">
            <span aria-hidden>✕ </span>Problems also on page{problemPages.length === 1 ? '' : 's'}
          </span>
          {problemPages.slice(0, 12).map((p) => (
            <Button key={p} size="sm" variant="quiet" disabled={busy} onClick={() => onPage(p)}>
              {p}
            </Button>
          ))}
          {problemPages.length > 12 ? <span>and {problemPages.length - 12} more</span> : null}
        </span>
      ) : null}
    </nav>
  );
}

/**
 * The file as read (one page of its lines): one column per file column, a choice of field under each header, and every
 * problem shown in its own cell (or on its line when it belongs to the whole line).
 */
export function PreviewTable({
  table,
  mapping,
  index,
  planned,
  onMappingChange,
  disabled,
}: {
  table: Array<{ row: number; cells: string[] }>;
  mapping: ColumnMapping[];
  index: PreviewIndex;
  /** Whether the server worked out what each row would do. */
  planned: boolean;
  onMappingChange: (column: number, target: ColumnTarget) => void;
  disabled?: boolean;
}) {
  const rows = table;

  return (
    <div>
      <div
        className={`overflow-auto rounded-lg border border-rule bg-paper-raised ${rows.length > 25 ? 'max-h-[44rem]' : ''}`}
      >
        <table className="lw-table w-full border-collapse text-sm">
          <caption className="sr-only">
            The file as read, with each problem in its cell and the column choices in the header
          </caption>
          <thead className="sticky top-0 z-10 border-b border-rule bg-paper-sunk">
            <tr>
              <th scope="col" className="px-3 py-2 align-bottom">
                Line
              </th>
              <th scope="col" className="min-w-32 px-3 py-2 align-bottom">
                What the import does
              </th>
              {mapping.map((column, i) => (
                <th key={i} scope="col" className="min-w-32 px-3 py-2 align-bottom">
                  <span
                    className={`block font-mono text-[0.8125rem] ${column.target === IGNORE ? 'text-ink-faint' : 'text-ink'}`}
                  >
                    {column.header || '(no header)'}
                  </span>
                  <select
                    aria-label={`Use column “${column.header || i + 1}” as`}
                    value={column.target}
                    disabled={disabled}
                    onChange={(e) => onMappingChange(i, e.target.value as ColumnTarget)}
                    className="mt-1 w-full rounded border border-rule-strong bg-paper-raised px-1.5 py-1 text-xs font-normal text-ink"
                  >
                    {COLUMN_TARGETS.map((target) => (
                      <option key={target} value={target}>
                        {targetLabel(target)}
                      </option>
                    ))}
                  </select>
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {rows.map((record) => {
              const lineProblems = index.line.get(record.row);
              const refused = index.problemRows.has(record.row);
              return (
                <tr key={record.row} className="border-b border-rule/70 last:border-0">
                  <th
                    scope="row"
                    className="px-3 py-2 text-left align-top font-mono text-xs font-normal text-ink-faint"
                  >
                    {record.row}
                  </th>
                  <td
                    className={`min-w-40 px-3 py-2 align-top text-xs ${lineProblems ? 'bg-fault-wash' : ''}`}
                  >
                    <ChangeCell
                      change={index.change.get(record.row)}
                      refused={refused}
                      planned={planned}
                    />
                    {lineProblems?.map((m, i) => (
                      <Problem key={i} message={m} />
                    ))}
                  </td>
                  {mapping.map((column, i) => {
                    const problems = index.cell.get(cellKey(record.row, column.header));
                    const value = record.cells[i] ?? '';
                    return (
                      <td
                        key={i}
                        className={`max-w-[24rem] px-3 py-2 align-top ${
                          problems
                            ? 'min-w-[13rem] border-l-2 border-l-fault bg-fault-wash'
                            : column.target === IGNORE
                              ? 'text-ink-faint'
                              : ''
                        }`}
                      >
                        <span className="break-words whitespace-pre-wrap">
                          {value === '' ? <span className="text-ink-faint">—</span> : value}
                        </span>
                        {problems?.map((m, j) => (
                          <Problem key={j} message={m} />
                        ))}
                      </td>
                    );
                  })}
                </tr>
              );
            })}
          </tbody>
        </table>
      </div>
    </div>
  );
}
