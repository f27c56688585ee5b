import type { Request, Response } from 'express';
import type { IdParams } from '#shared/schemas/common.schema.ts';
import type { RevisionParams } from '#shared/schemas/revisions.schema.ts';
import { actorOf } from '../../lib/actor.ts';
import { AppError } from '../../lib/errors.ts';
import { logger } from '../../lib/logger.ts';
import { parsedParams } from '../../lib/request.ts';
import type { WorksheetInput } from './pdf/meta.ts';
import { renderWorksheet, sendWorksheet } from './pdf/render.ts';
import { WorksheetTimeoutError } from './pdf/sheet.ts';
import {
  draftWorksheetInput,
  revisionWorksheetInput,
  worksheetFileName,
} from './worksheet.service.ts';

/**
 * Chrome shows a PDF through a built-in viewer in a page of its own that the response's CSP
 * governs: the app's `object-src 'none'` would block it (crbug.com/271452). The PDF gets a policy
 * of its own that allows just that viewer.
 */
const PDF_CSP =
  "default-src 'none'; object-src 'self'; style-src 'unsafe-inline'; frame-ancestors 'self'";

/**
 * Lays the worksheet out first and only then starts the response, so a failure is still an
 * ordinary JSON error rather than a truncated PDF.
 */
async function sendWorksheetPdf(req: Request, res: Response, input: WorksheetInput) {
  const started = performance.now();
  let doc: PDFKit.PDFDocument;
  try {
    doc = await renderWorksheet(input);
  } catch (err) {
    if (err instanceof WorksheetTimeoutError) {
      throw new AppError(
        503,
        'worksheet_timeout',
        'The worksheet took too long to prepare. Try again in a moment.',
        undefined,
        { 'Retry-After': '5' },
      );
    }
    throw err;
  }
  const pages = doc.bufferedPageRange().count;
  const fileName = worksheetFileName(input.snapshot, input.meta.revision);
  res.status(200).set({
    'Content-Type': 'application/pdf',
    'Content-Disposition': `inline; filename="${fileName}"`,
    'X-Content-Type-Options': 'nosniff',
    'Cache-Control': 'no-store',
    'Content-Security-Policy': PDF_CSP,
  });
  await sendWorksheet(doc, res);
  logger.info(
    {
      requestId: req.requestId,
      conversionId: input.snapshot.conversion.id,
      revision: input.meta.revision?.number ?? null,
      pins: input.snapshot.pins.length,
      pages,
      ms: Math.round(performance.now() - started),
    },
    'worksheet printed',
  );
}

export async function draftWorksheet(req: Request, res: Response) {
  const { id } = parsedParams<IdParams>(req);
  await sendWorksheetPdf(req, res, await draftWorksheetInput(actorOf(req), id));
}

/** A revision's worksheet, printed from its frozen snapshot with its status, hash and sign-off. */
export async function revisionWorksheet(req: Request, res: Response) {
  const { id, number } = parsedParams<RevisionParams>(req);
  await sendWorksheetPdf(req, res, await revisionWorksheetInput(actorOf(req), id, number));
}
