import type { Request, Response } from 'express';
import type { IdParams } from '#shared/schemas/common.schema.ts';
import type { ImportQuery } from '#shared/schemas/imports.schema.ts';
import { actorOf } from '../../lib/actor.ts';
import { parsedParams, parsedQuery } from '../../lib/request.ts';
import { uploadedFile } from '../../lib/upload.ts';
import { exportPinsCsv, templateCsv } from './export.service.ts';
import { importPinout, type ImportSource, type ImportTarget } from './imports.service.ts';

function mappingField(req: Request): unknown {
  const body = req.body as Record<string, unknown> | undefined;
  return body && Object.hasOwn(body, 'mapping') ? body.mapping : undefined;
}

async function runImport(req: Request, res: Response, target: ImportTarget) {
  const { dryRun, page, grow, preview } = parsedQuery<ImportQuery>(req);
  // A kept preview is applied by its id without the file; a file sent as well is read instead.
  const source: ImportSource =
    preview !== undefined && !req.file
      ? { previewId: preview }
      : { file: uploadedFile(req), mapping: mappingField(req) };
  const result = await importPinout(actorOf(req), target, source, dryRun, page, grow);
  res.json(result);
}

export async function importIntoConnector(req: Request, res: Response) {
  const { id } = parsedParams<IdParams>(req);
  await runImport(req, res, { kind: 'connector', connectorId: id });
}

export async function importIntoConversion(req: Request, res: Response) {
  const { id } = parsedParams<IdParams>(req);
  await runImport(req, res, { kind: 'conversion', conversionId: id });
}

function sendCsv(res: Response, fileName: string, body: string) {
  res.setHeader('Content-Type', 'text/csv; charset=utf-8; header=present');
  res.setHeader('Content-Disposition', `attachment; filename="${fileName}"`);
  res.setHeader('Cache-Control', 'private, no-store');
  res.send(body);
}

export async function exportPins(req: Request, res: Response) {
  const { id } = parsedParams<IdParams>(req);
  const { fileName, body } = await exportPinsCsv(actorOf(req), id);
  sendCsv(res, fileName, body);
}

export function pinoutTemplate(_req: Request, res: Response) {
  sendCsv(res, 'loomwright-pinout-template.csv', templateCsv());
}
