/** One measured figure of a bench case, printed beside its baseline. */
export interface BenchRow {
  case: string;
  subject: string;
  figures: Record<string, number>;
}

export function printRows(rows: BenchRow[]) {
  const keys = [...new Set(rows.flatMap((r) => Object.keys(r.figures)))];
  const header = ['case', 'subject', ...keys];
  const lines = rows.map((r) => [r.case, r.subject, ...keys.map((k) => format(r.figures[k]))]);
  const widths = header.map((h, i) => Math.max(h.length, ...lines.map((l) => l[i]!.length)));
  const fmt = (cells: string[]) =>
    '| ' + cells.map((c, i) => c.padEnd(widths[i]!)).join(' | ') + ' |';
  console.log(fmt(header));
  console.log('|' + widths.map((w) => '-'.repeat(w + 2)).join('|') + '|');
  for (const line of lines) console.log(fmt(line));
}

function format(value: number | undefined): string {
  if (value === undefined) return '';
  if (Number.isInteger(value)) return String(value);
  return value >= 100 ? value.toFixed(0) : value.toFixed(2);
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
