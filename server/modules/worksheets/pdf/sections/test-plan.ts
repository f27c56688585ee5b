/** The generated test plan: what to measure before and at first power-up, with a box for each reading. */
import { buildTestPlan, TEST_PHASE_INFO } from '#shared/domain/test-plan.ts';
import { TEST_PHASES } from '#shared/schemas/test-plan.schema.ts';
import type { PlanIndex } from '../plan.ts';
import type { Sheet } from '../sheet.ts';
import { drawTable, type Row } from '../table.ts';
import { flow, heading, readingCell, SMALL, tickCell } from './common.ts';

export const TEST_PLAN_TITLE = 'Test plan';

export async function drawTestPlan(sheet: Sheet, index: PlanIndex): Promise<void> {
  const plan = buildTestPlan(index.snapshot);
  sheet.addPage();
  sheet.section(TEST_PLAN_TITLE);
  heading(
    sheet,
    TEST_PLAN_TITLE,
    `Generated from this plan. Wire resistance for copper at ${plan.benchTempC} °C from each run's size and length. Write each reading in its unit and tick pass or fail; note what was found on a fail. Local codes and licensed practice prevail.`,
  );
  for (const phase of TEST_PHASES) {
    const steps = plan.steps.filter((s) => s.phase === phase);
    if (!steps.length) continue;
    const info = TEST_PHASE_INFO[phase];
    heading(sheet, info.title, info.caution, 60);
    const rows: Row[] = steps.map((s) => ({
      cells: [
        { text: s.subject, style: { face: 'monoBold', size: 8 } },
        { text: s.what },
        { text: s.expectedText || '—', style: { face: 'mono', size: 8 } },
        { text: s.limitText || '—', style: { face: 'mono', size: 8 } },
        s.unit === 'check' ? { text: '' } : readingCell(s.unit),
        tickCell(),
        tickCell(),
      ],
    }));
    await drawTable(sheet, {
      continued: `${TEST_PLAN_TITLE}: ${info.title}`,
      columns: [
        { title: 'Where', width: 72 },
        { title: 'Test', flex: 1 },
        { title: 'Expected', width: 70 },
        { title: 'Pass', width: 86 },
        { title: 'Reading', width: 62 },
        { title: 'Pass', width: 28, align: 'center' },
        { title: 'Fail', width: 28, align: 'center' },
      ],
      rows,
      minRowHeight: 18,
      zebra: true,
    });
    sheet.y += 8;
  }
  const sources = [...new Set(plan.steps.map((s) => s.source))];
  sheet.ensure(30);
  flow(sheet, 'Where the limits come from', { ...SMALL, face: 'semibold' });
  for (const source of sources) flow(sheet, `· ${source}`, SMALL, 4);
}
