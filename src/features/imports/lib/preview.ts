import type { ImportChange, ImportIssue, ImportResult } from '#shared/schemas/imports.schema.ts';

export interface PreviewIndex {
  /** Problems of one cell, by "line␟header". */
  cell: Map<string, string[]>;
  /** Problems of a whole line (wrong width, unreadable quotes). */
  line: Map<number, string[]>;
  /** Problems of the file, its header line or the connector as a whole. */
  file: ImportIssue[];
  /** The change each line makes. */
  change: Map<number, ImportChange>;
  /** Lines with a problem in a cell or in the line. */
  problemRows: Set<number>;
}

export const cellKey = (row: number, column: string) => `${row}\u241f${column}`;

/** Sorts a result's problems to the place they are shown: in their cell, their line, or above. */
export function indexPreview(
  result: Pick<ImportResult, 'errors' | 'changes' | 'mapping'>,
  headerRow = 1,
): PreviewIndex {
  const headers = new Set(result.mapping.map((m) => m.header));
  const index: PreviewIndex = {
    cell: new Map(),
    line: new Map(),
    file: [],
    change: new Map(),
    problemRows: new Set(),
  };
  for (const issue of result.errors) {
    if (issue.row === null || issue.row === headerRow) {
      index.file.push(issue);
    } else if (issue.column !== null && headers.has(issue.column)) {
      const key = cellKey(issue.row, issue.column);
      index.cell.set(key, [...(index.cell.get(key) ?? []), issue.message]);
      index.problemRows.add(issue.row);
    } else {
      index.line.set(issue.row, [...(index.line.get(issue.row) ?? []), issue.message]);
      index.problemRows.add(issue.row);
    }
  }
  for (const change of result.changes) {
    if (change.kind !== 'remove') index.change.set(change.row, change);
  }
  return index;
}

export function plural(n: number, one: string, many = `${one}s`): string {
  return `${n.toLocaleString('en')} ${n === 1 ? one : many}`;
}
