/**
 * `npm run bench`: speed and memory figures, each a ratio to a baseline doing the same work in the
 * same run (or an absolute figure where the goal is one), median [min–max] over the rounds.
 * Servers run in processes of their own; the load generator runs here.
 *
 *   BENCH_SECONDS  length of each HTTP load run (default 3)
 *   BENCH_ROUNDS   rounds per case, product and baseline alternating (default 3, at least 3)
 *   npm run bench -- <name>   only the cases whose name contains <name>
 *
 * The browser cases (P5, P6) need the built client (`npx vite build`) and Chromium.
 */
import { browserBench } from './cases/browser.ts';
import { checksBench } from './cases/checks.ts';
import { importCsv } from './cases/import.ts';
import { pinsList } from './cases/pins-list.ts';
import { worksheetBench } from './cases/worksheet.ts';
import { printRows, type BenchRow } from './lib/report.ts';

const seconds = Number(process.env.BENCH_SECONDS ?? 3);
const rounds = Math.max(3, Number(process.env.BENCH_ROUNDS ?? 3));
const only = process.argv[2];

const CASES: Record<string, () => Promise<BenchRow[]>> = {
  'pins-list': () => pinsList(seconds, rounds),
  checks: () => checksBench(rounds),
  worksheet: () => worksheetBench(rounds),
  import: () => importCsv(rounds),
  browser: () => browserBench(rounds),
};

const started = performance.now();
const rows: BenchRow[] = [];
for (const [name, run] of Object.entries(CASES)) {
  if (only && !name.includes(only)) continue;
  process.stderr.write(`bench: ${name}…\n`);
  rows.push(...(await run()));
}
const cpus = (await import('node:os')).cpus().length;
const loadAvg = (await import('node:os')).loadavg()[0]!.toFixed(1);
console.log(
  `Loomwright bench, ${new Date().toISOString()}, ${cpus} cores, load average ${loadAvg} at the end, ` +
    `${rounds} rounds, ${seconds} s per HTTP run, ${((performance.now() - started) / 1000).toFixed(0)} s in all`,
);
printRows(rows.sort((a, b) => a.id.localeCompare(b.id)));
process.exit(0);
