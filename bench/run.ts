/**
 * `npm run bench`: speed and memory figures, each printed beside a baseline measured in the same
 * run on the same machine. `BENCH_SECONDS` sets each HTTP load run's length (default 5).
 * `npm run bench -- <name>` runs only the cases whose name contains <name>.
 */
import { checksBench } from './cases/checks.ts';
import { conversionsList } from './cases/conversions-list.ts';
import { importCsv } from './cases/import.ts';
import { pinsList } from './cases/pins-list.ts';
import { worksheetBench } from './cases/worksheet.ts';
import { printRows, type BenchRow } from './lib/report.ts';

const seconds = Number(process.env.BENCH_SECONDS ?? 5);
const only = process.argv[2];

const CASES: Record<string, () => Promise<BenchRow[]>> = {
  'conversions-list': () => conversionsList(seconds),
  'pins-list': () => pinsList(seconds),
  checks: () => checksBench(),
  import: () => importCsv(),
  worksheet: () => worksheetBench(),
};

const rows: BenchRow[] = [];
for (const [name, run] of Object.entries(CASES)) {
  if (only && !name.includes(only)) continue;
  process.stderr.write(`bench: ${name}…\n`);
  rows.push(...(await run()));
}
printRows(rows);
process.exit(0);
