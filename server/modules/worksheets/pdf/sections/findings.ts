/** Open findings: the errors and warnings of the checks, with where they are and their source. */
import type { Finding } from '#shared/schemas/checks.schema.ts';
import { pinName, type PlanIndex } from '../plan.ts';
import type { Sheet } from '../sheet.ts';
import { drawTable, type Row } from '../table.ts';
import { count, heading } from './common.ts';

export const FINDINGS_TITLE = 'Open findings';

export function openFindings(findings: Finding[]): Finding[] {
  return findings.filter((f) => f.severity === 'error' || f.severity === 'warning');
}

function where(index: PlanIndex, f: Finding): string {
  const parts: string[] = [];
  if (f.subject.feedId != null) {
    parts.push(`Feed: ${index.feeds.get(f.subject.feedId)?.name ?? `#${f.subject.feedId}`}`);
  }
  const pins = f.subject.pinIds ?? [];
  if (pins.length) {
    const names = pins.slice(0, 40).map((id) => pinName(index, id));
    parts.push(names.join(', ') + (pins.length > 40 ? ` and ${pins.length - 40} more` : ''));
  }
  return parts.join('\n');
}

export async function drawFindings(sheet: Sheet, index: PlanIndex): Promise<void> {
  const open = openFindings(sheet.meta.findings);
  sheet.addPage();
  sheet.section(FINDINGS_TITLE);
  const errors = open.filter((f) => f.severity === 'error').length;
  heading(
    sheet,
    FINDINGS_TITLE,
    `${count(errors, 'error')} and ${count(open.length - errors, 'warning')} from the circuit checks${sheet.meta.revision ? ' of this revision' : ', run when this draft was printed'}. Settle each before the harness is powered.`,
  );
  const rows: Row[] = open.map((f) => ({
    cells: [
      {
        text: f.severity === 'error' ? 'ERROR' : 'WARNING',
        style: { face: 'bold', size: 8 },
      },
      { title: f.title, text: f.message },
      { text: where(index, f), style: { face: 'mono', size: 7.5 } },
      { text: f.source, style: { size: 7.5 } },
    ],
  }));
  await drawTable(sheet, {
    continued: FINDINGS_TITLE,
    columns: [
      { title: 'Severity', width: 56 },
      { title: 'Finding', flex: 2.4 },
      { title: 'Where', width: 80 },
      { title: 'Source', flex: 1 },
    ],
    rows,
    minRowHeight: 18,
  });
}
