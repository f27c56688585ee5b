/**
 * One line of the bench table: what was measured, the figure as printed (median [min–max] over the
 * rounds, a ratio always product ÷ baseline), the goal beside it and whether the figure meets it.
 */
export interface BenchRow {
  id: string;
  measure: string;
  figure: string;
  goal: string;
  met: boolean | null;
}

export function printRows(rows: BenchRow[]) {
  const header = ['id', 'measure', 'figure', 'goal', 'met'];
  const lines = rows.map((r) => [
    r.id,
    r.measure,
    r.figure,
    r.goal,
    r.met === null ? '–' : r.met ? 'yes' : 'NO',
  ]);
  const widths = header.map((h, i) => Math.max(h.length, ...lines.map((l) => l[i]!.length)));
  const fmt = (cells: string[]) =>
    '| ' + cells.map((c, i) => c.padEnd(widths[i]!)).join(' | ') + ' |';
  console.log(fmt(header));
  console.log('|' + widths.map((w) => '-'.repeat(w + 2)).join('|') + '|');
  for (const line of lines) console.log(fmt(line));
}

/** Runs `fn` and reports its wall time and the peak heap growth seen while it ran. */
export async function measure<T>(
  fn: () => Promise<T> | T,
): Promise<{ result: T; ms: number; peakHeapMb: number }> {
  global.gc?.();
  const base = process.memoryUsage().heapUsed;
  let peak = base;
  const timer = setInterval(() => {
    peak = Math.max(peak, process.memoryUsage().heapUsed);
  }, 5);
  const started = performance.now();
  try {
    const result = await fn();
    const ms = performance.now() - started;
    peak = Math.max(peak, process.memoryUsage().heapUsed);
    return { result, ms, peakHeapMb: (peak - base) / 1024 / 1024 };
  } finally {
    clearInterval(timer);
  }
}
