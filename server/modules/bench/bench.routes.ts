import { Router, type Request, type Response } from 'express';
import { BenchItemParams, BenchRecordRequest } from '#shared/schemas/bench.schema.ts';
import { IdParams } from '#shared/schemas/common.schema.ts';
import { RevisionParams } from '#shared/schemas/revisions.schema.ts';
import { config } from '../../config/runtime.ts';
import { actorOf } from '../../lib/actor.ts';
import { parsedParams } from '../../lib/request.ts';
import { singleFileUpload, uploadedFile } from '../../lib/upload.ts';
import { authorize } from '../../middleware/authorize.ts';
import { validate } from '../../middleware/validate.ts';
import * as bench from './bench.service.ts';

async function sheet(req: Request, res: Response) {
  const { id } = parsedParams<IdParams>(req);
  res.json(await bench.getBenchSheet(actorOf(req), id));
}

async function revisionSheet(req: Request, res: Response) {
  const { id, number } = parsedParams<RevisionParams>(req);
  res.json(await bench.getBenchSheet(actorOf(req), id, number));
}

async function testPlan(req: Request, res: Response) {
  const { id, number } = parsedParams<RevisionParams>(req);
  res.json(await bench.getTestPlan(actorOf(req), id, number));
}

async function record(req: Request, res: Response) {
  const { id, number, key } = parsedParams<BenchItemParams>(req);
  res.json({
    record: await bench.recordBenchWork(
      actorOf(req),
      id,
      number,
      key,
      req.body as BenchRecordRequest,
    ),
  });
}

async function addPhoto(req: Request, res: Response) {
  const { id, number, key } = parsedParams<BenchItemParams>(req);
  const photo = await bench.addBenchPhoto(actorOf(req), id, number, key, uploadedFile(req));
  res.status(201).json({ photo });
}

async function downloadPhoto(req: Request, res: Response) {
  const { id } = parsedParams<IdParams>(req);
  const { photo, bytes } = await bench.readBenchPhoto(actorOf(req), id);
  res.setHeader('Content-Type', photo.contentType);
  res.setHeader('Content-Length', String(bytes.length));
  // Shown inline on the revision page; an image only, and nothing in it may run.
  res.setHeader('X-Content-Type-Options', 'nosniff');
  res.setHeader('Content-Security-Policy', "default-src 'none'; sandbox");
  res.setHeader('Cache-Control', 'private, max-age=3600');
  res.end(bytes);
}

const photoUpload = singleFileUpload({ maxBytes: () => config().ATTACHMENT_MAX_BYTES });

/** Mounted at /api/conversions: the bench checklist, its test plan and photos. */
export const benchRoutes = Router();
benchRoutes.get('/:id/bench', authorize('conversion:read'), validate({ params: IdParams }), sheet);
benchRoutes.get(
  '/:id/revisions/:number/bench',
  authorize('conversion:read'),
  validate({ params: RevisionParams }),
  revisionSheet,
);
benchRoutes.get(
  '/:id/revisions/:number/test-plan',
  authorize('conversion:read'),
  validate({ params: RevisionParams }),
  testPlan,
);
benchRoutes.put(
  '/:id/revisions/:number/bench/:key',
  authorize('bench:record'),
  validate({ params: BenchItemParams, body: BenchRecordRequest }),
  record,
);
benchRoutes.post(
  '/:id/revisions/:number/bench/:key/photos',
  authorize('bench:record'),
  validate({ params: BenchItemParams }),
  photoUpload,
  addPhoto,
);

/** Mounted at /api/bench-photos: photos are read through here, never from a static folder. */
export const benchPhotoRoutes = Router();
benchPhotoRoutes.get(
  '/:id',
  authorize('conversion:read'),
  validate({ params: IdParams }),
  downloadPhoto,
);
