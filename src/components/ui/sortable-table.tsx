import {
  createSortedRowModel,
  rowSortingFeature,
  sortFn_alphanumeric,
  sortFn_datetime,
  sortFn_text,
  tableFeatures,
  useTable,
  type ColumnDef,
  type RowData,
  type SortingState,
} from '@tanstack/react-table';
import { useState, type ReactNode } from 'react';

const sortableFeatures = tableFeatures({
  rowSortingFeature,
  sortedRowModel: createSortedRowModel(),
  sortFns: { alphanumeric: sortFn_alphanumeric, text: sortFn_text, datetime: sortFn_datetime },
});

export type SortableColumn<TData extends RowData> = ColumnDef<typeof sortableFeatures, TData>;

interface SortableTableProps<TData extends RowData> {
  columns: SortableColumn<TData>[];
  data: TData[];
  caption: string;
  initialSorting?: SortingState;
  getRowId?: (row: TData) => string;
  empty?: ReactNode;
}

const SORT_GLYPH = { asc: '▲', desc: '▼' } as const;

/** The sort mark beside a column heading: which way it sorts, or that it can. */
export function SortGlyph({ sorted }: { sorted: false | 'asc' | 'desc' }) {
  return (
    <span aria-hidden className="text-[0.625rem] text-copper">
      {sorted ? SORT_GLYPH[sorted] : '↕'}
    </span>
  );
}

/** A plain, dense, sortable table: click or press Enter on a header to sort by it. */
export function SortableTable<TData extends RowData>({
  columns,
  data,
  caption,
  initialSorting = [],
  getRowId,
  empty,
}: SortableTableProps<TData>) {
  const [sorting, setSorting] = useState<SortingState>(initialSorting);
  const table = useTable({
    features: sortableFeatures,
    columns,
    data,
    getRowId: getRowId ? (row) => getRowId(row) : undefined,
    state: { sorting },
    onSortingChange: setSorting,
  });
  const rows = table.getRowModel().rows;
  return (
    <div className="overflow-x-auto rounded-lg border border-rule bg-paper-raised">
      <table className="lw-table w-full border-collapse text-[0.9375rem]">
        <caption className="sr-only">{caption}</caption>
        <thead className="border-b border-rule bg-paper-sunk/60">
          {table.getHeaderGroups().map((group) => (
            <tr key={group.id}>
              {group.headers.map((header) => {
                const sorted = header.column.getIsSorted();
                const canSort = header.column.getCanSort();
                return (
                  <th
                    key={header.id}
                    scope="col"
                    aria-sort={
                      sorted === 'asc' ? 'ascending' : sorted === 'desc' ? 'descending' : undefined
                    }
                    className="px-3 py-2"
                  >
                    {canSort ? (
                      <button
                        type="button"
                        onClick={header.column.getToggleSortingHandler()}
                        className="inline-flex items-center gap-1 font-semibold hover:text-ink"
                      >
                        <table.FlexRender header={header} />
                        <SortGlyph sorted={sorted} />
                      </button>
                    ) : (
                      <table.FlexRender header={header} />
                    )}
                  </th>
                );
              })}
            </tr>
          ))}
        </thead>
        <tbody>
          {rows.length === 0 ? (
            <tr>
              <td colSpan={columns.length} className="px-3 py-6 text-center text-ink-faint">
                {empty ?? 'Nothing here yet.'}
              </td>
            </tr>
          ) : (
            rows.map((row) => (
              <tr
                key={row.id}
                className="border-b border-rule/70 last:border-0 hover:bg-paper-sunk/40"
              >
                {row.getAllCells().map((cell) => (
                  <td key={cell.id} className="px-3 py-2.5 align-top">
                    <table.FlexRender cell={cell} />
                  </td>
                ))}
              </tr>
            ))
          )}
        </tbody>
      </table>
    </div>
  );
}
