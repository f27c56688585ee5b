import {
  columnSizingFeature,
  columnVisibilityFeature,
  createColumnHelper,
  createSortedRowModel,
  rowSelectionFeature,
  rowSortingFeature,
  sortFn_alphanumeric,
  sortFn_basic,
  sortFn_text,
  tableFeatures,
} from '@tanstack/react-table';
import type { SizeUnit } from '#shared/schemas/workshop.schema.ts';
import {
  type GridColumnId,
  type PinColumnId,
  PIN_COLUMNS,
  SELECT_COLUMN,
  columnHeader,
  sortValue,
} from '../lib/columns.ts';
import type { PinRow } from '../lib/rows.ts';
import type { ColumnLayout } from './grid-row.tsx';

/** The table features the pin grid uses; filtering happens before the table (lib/filter.ts). */
export const pinGridFeatures = tableFeatures({
  rowSortingFeature,
  rowSelectionFeature,
  columnVisibilityFeature,
  columnSizingFeature,
  sortedRowModel: createSortedRowModel(),
  sortFns: { alphanumeric: sortFn_alphanumeric, text: sortFn_text, basic: sortFn_basic },
});
export type PinGridFeatures = typeof pinGridFeatures;

/** Column widths in px; rows are 40 px high, roomy enough for a gloved tap. */
const COLUMN_WIDTHS: Record<GridColumnId, number> = {
  select: 40,
  connector: 104,
  cavity: 76,
  function: 220,
  signalClass: 140,
  colour: 104,
  size: 96,
  insulation: 96,
  disposition: 180,
  destination: 170,
  runLength: 80,
  load: 80,
  driverType: 116,
  driverRated: 80,
  pulseSignal: 112,
  pulsesPerRev: 76,
  termination: 80,
  notes: 220,
};

/** Columns that stay in view when the grid scrolls sideways: which pin a row is. */
const STICKY_COLUMNS: ReadonlySet<string> = new Set([SELECT_COLUMN, 'connector', 'cavity']);

const SORT_FN: Record<PinColumnId, 'alphanumeric' | 'text' | 'basic'> = {
  connector: 'alphanumeric',
  cavity: 'alphanumeric',
  function: 'text',
  signalClass: 'basic',
  colour: 'text',
  size: 'basic',
  insulation: 'basic',
  disposition: 'basic',
  destination: 'text',
  runLength: 'basic',
  load: 'basic',
  driverType: 'text',
  driverRated: 'basic',
  pulseSignal: 'text',
  pulsesPerRev: 'basic',
  termination: 'basic',
  notes: 'text',
};

const helper = createColumnHelper<PinGridFeatures, PinRow>();

export function pinGridColumns(unit: SizeUnit) {
  return helper.columns([
    helper.display({
      id: SELECT_COLUMN,
      header: 'Select',
      size: COLUMN_WIDTHS.select,
      enableSorting: false,
      enableHiding: false,
    }),
    ...PIN_COLUMNS.map((id) =>
      helper.accessor((row) => sortValue(row, id), {
        id,
        header: columnHeader(id, unit),
        size: COLUMN_WIDTHS[id],
        sortFn: SORT_FN[id],
        sortUndefined: 'last',
        enableHiding: id !== 'cavity',
      }),
    ),
  ]);
}

/** Where each visible column sits in a row; sticky columns stay put when the grid scrolls sideways. */
export function columnLayout(ids: readonly string[], unit: SizeUnit): ColumnLayout[] {
  let left = 0;
  return ids.map((id) => {
    const width = COLUMN_WIDTHS[id as GridColumnId] ?? 120;
    const column = {
      id,
      header: id === SELECT_COLUMN ? 'Select' : columnHeader(id as PinColumnId, unit),
      width,
      left,
      sticky: STICKY_COLUMNS.has(id),
    };
    left += width;
    return column;
  });
}
