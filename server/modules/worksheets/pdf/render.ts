/**
 * The bench worksheet of one conversion plan, from a snapshot and its meta. Knows nothing of Express
 * or the database: the draft route feeds it the live plan, the revision route a frozen snapshot.
 */
import type { Writable } from 'node:stream';
import PDFDocument from 'pdfkit';
import { CIRCUITS_TITLE, drawHarness, WIRES_TITLE } from './sections/harness.ts';
import { buildCutList } from './cut-list.ts';
import { registerFonts, shareWordLayouts, warmFonts } from './fonts.ts';
import type { WorksheetInput, WorksheetMeta, WorksheetRevision } from './meta.ts';
import { indexPlan } from './plan.ts';
import { ACTIONS_TITLE, drawActions } from './sections/actions.ts';
import { connectorTitle, drawConnector } from './sections/connector.ts';
import { drawFindings, FINDINGS_TITLE, openFindings } from './sections/findings.ts';
import {
  CUT_LIST_TITLE,
  drawCutList,
  drawFuseSchedule,
  FUSES_TITLE,
} from './sections/materials.ts';
import { drawTestPlan, TEST_PLAN_TITLE } from './sections/test-plan.ts';
import { drawTitlePage, fillContents } from './sections/title-page.ts';
import { Sheet, type SheetOptions } from './sheet.ts';
import { cleanText } from './text.ts';

/**
 * Lays out every page and writes the footers. The document is returned not yet ended: pipe it
 * where it goes, then call `end()`. Nothing is sent before the layout has succeeded, so a failure
 * can still be answered as an ordinary error.
 */
export async function renderWorksheet(
  input: WorksheetInput,
  options: SheetOptions = {},
): Promise<PDFKit.PDFDocument> {
  const { snapshot, meta } = input;
  await warmFonts();
  const name = cleanText(snapshot.conversion.name, { maxChars: 200, singleLine: true });
  const doc = new PDFDocument({
    autoFirstPage: false,
    bufferPages: true,
    compress: true,
    lang: 'en',
    displayTitle: true,
    info: {
      Title: `Bench worksheet: ${name}${meta.revision ? `, revision ${meta.revision.number}` : ', draft'}`,
      Author: cleanText(meta.workshopName, { maxChars: 200, singleLine: true }),
      Creator: 'Loomwright',
      CreationDate: meta.printedAt,
    },
  });
  registerFonts(doc);
  shareWordLayouts(doc);
  const sheet = new Sheet(
    doc,
    snapshot,
    { ...meta, paperSize: meta.paperSize === 'Letter' ? 'Letter' : 'A4' },
    options,
  );
  const index = indexPlan(snapshot);
  const cutList = buildCutList(index, meta.serviceAllowancePct);
  const hasFindings = openFindings(meta.findings).length > 0;

  const titles = [
    ...(hasFindings ? [FINDINGS_TITLE] : []),
    CUT_LIST_TITLE,
    FUSES_TITLE,
    ...(snapshot.harness ? [WIRES_TITLE, CIRCUITS_TITLE] : []),
    ACTIONS_TITLE,
    ...snapshot.connectors.map(connectorTitle),
    TEST_PLAN_TITLE,
  ];
  const contents = await drawTitlePage(sheet, index, titles);
  await sheet.pause();
  if (hasFindings) await drawFindings(sheet, index);
  await drawCutList(sheet, index, cutList);
  await drawFuseSchedule(sheet, index);
  if (snapshot.harness) await drawHarness(sheet, index);
  await drawActions(sheet, index);
  for (const connector of snapshot.connectors) await drawConnector(sheet, index, connector);
  await drawTestPlan(sheet, index);

  fillContents(sheet, contents);
  sheet.drawFooters();
  return doc;
}

/** A submitted or signed-off revision's worksheet, from its frozen snapshot: never marked DRAFT. */
export function renderRevisionWorksheet(
  input: WorksheetInput & { meta: WorksheetMeta & { revision: WorksheetRevision } },
  options: SheetOptions = {},
): Promise<PDFKit.PDFDocument> {
  if (!input.meta.revision) throw new TypeError('a revision worksheet needs its revision');
  return renderWorksheet(input, options);
}

/**
 * Writes out the pages, pauses for the event loop, then ends the document (fonts subset and
 * embedded): the two largest pieces of pdfkit's own work, kept apart.
 */
async function finish(doc: PDFKit.PDFDocument): Promise<void> {
  doc.flushPages();
  await new Promise<void>((resolve) => setImmediate(resolve));
  doc.end();
}

/** Ends a laid-out document into `out` and resolves once everything is written. */
export function sendWorksheet(doc: PDFKit.PDFDocument, out: Writable): Promise<void> {
  return new Promise((resolve, reject) => {
    out.once('finish', resolve);
    out.once('error', reject);
    out.once('close', resolve);
    doc.once('error', reject);
    doc.pipe(out);
    finish(doc).catch(reject);
  });
}

/** The whole PDF in memory: for tests and the bench. */
export async function worksheetBuffer(
  input: WorksheetInput,
  options: SheetOptions = {},
): Promise<Buffer> {
  const doc = await renderWorksheet(input, options);
  const chunks: Buffer[] = [];
  return new Promise((resolve, reject) => {
    doc.on('data', (chunk: Buffer) => chunks.push(chunk));
    doc.once('end', () => resolve(Buffer.concat(chunks)));
    doc.once('error', reject);
    finish(doc).catch(reject);
  });
}
