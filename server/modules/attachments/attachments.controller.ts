import type { Request, Response } from 'express';
import type { IdParams } from '#shared/schemas/common.schema.ts';
import { actorOf } from '../../lib/actor.ts';
import { parsedParams } from '../../lib/request.ts';
import { uploadedFile } from '../../lib/upload.ts';
import * as service from './attachments.service.ts';

const EXTENSIONS: Record<string, string> = {
  'application/pdf': '.pdf',
  'image/png': '.png',
  'image/jpeg': '.jpg',
};

/** `filename=` in plain ASCII with the right extension, and the full name as `filename*` (RFC 6266). */
function contentDisposition(fileName: string, contentType: string): string {
  const ext = EXTENSIONS[contentType] ?? '';
  const stem = fileName.replace(/\.[A-Za-z0-9]{1,5}$/, '');
  const ascii = (stem.replace(/[^\w.-]+/g, '_').replace(/^[._]+/, '') || 'attachment') + ext;
  const full = /\.(pdf|png|jpe?g)$/i.test(fileName) ? fileName : fileName + ext;
  return `attachment; filename="${ascii}"; filename*=UTF-8''${encodeURIComponent(full)}`;
}

export async function addAttachment(req: Request, res: Response) {
  const { id } = parsedParams<IdParams>(req);
  const attachment = await service.addAttachment(actorOf(req), id, uploadedFile(req));
  res.status(201).json({ attachment });
}

export async function listAttachments(req: Request, res: Response) {
  const { id } = parsedParams<IdParams>(req);
  res.json({ attachments: await service.listAttachments(actorOf(req), id) });
}

export async function downloadAttachment(req: Request, res: Response) {
  const { id } = parsedParams<IdParams>(req);
  const { attachment, bytes } = await service.readAttachment(actorOf(req), id);
  res.setHeader('Content-Type', attachment.contentType);
  res.setHeader('Content-Length', String(bytes.length));
  res.setHeader(
    'Content-Disposition',
    contentDisposition(attachment.fileName, attachment.contentType),
  );
  res.setHeader('X-Content-Type-Options', 'nosniff');
  // Should a browser render it anyway, nothing in it may run.
  res.setHeader('Content-Security-Policy', "default-src 'none'; sandbox");
  res.setHeader('Cache-Control', 'private, no-store');
  res.end(bytes);
}

export async function deleteAttachment(req: Request, res: Response) {
  const { id } = parsedParams<IdParams>(req);
  await service.deleteAttachment(actorOf(req), id);
  res.status(204).end();
}
