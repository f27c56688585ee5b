import { Router, type Request, type Response } from 'express';
import { IdParams } from '#shared/schemas/common.schema.ts';
import {
  ReviewCommentRequest,
  CommentParams,
  RevisionParams,
  SendBackRequest,
  SignOffRequest,
  SubmitRevisionRequest,
} from '#shared/schemas/revisions.schema.ts';
import { actorOf } from '../../lib/actor.ts';
import { AppError } from '../../lib/errors.ts';
import { parsedParams } from '../../lib/request.ts';
import { authorize } from '../../middleware/authorize.ts';
import { validate } from '../../middleware/validate.ts';
import * as revisions from './revisions.service.ts';

async function list(req: Request, res: Response) {
  const { id } = parsedParams<IdParams>(req);
  res.json({ revisions: await revisions.listRevisions(actorOf(req), id) });
}

async function submit(req: Request, res: Response) {
  const { id } = parsedParams<IdParams>(req);
  const revision = await revisions.submitRevision(
    actorOf(req),
    id,
    req.body as SubmitRevisionRequest,
  );
  res.status(201).json({ revision });
}

async function get(req: Request, res: Response) {
  const { id, number } = parsedParams<RevisionParams>(req);
  res.json({ revision: await revisions.getRevision(actorOf(req), id, number) });
}

async function verify(req: Request, res: Response) {
  const { id, number } = parsedParams<RevisionParams>(req);
  res.json(await revisions.verifyRevision(actorOf(req), id, number));
}

async function signOff(req: Request, res: Response) {
  const { id, number } = parsedParams<RevisionParams>(req);
  res.json({
    revision: await revisions.signOff(actorOf(req), id, number, req.body as SignOffRequest),
  });
}

async function sendBack(req: Request, res: Response) {
  const { id, number } = parsedParams<RevisionParams>(req);
  res.json({
    revision: await revisions.sendBack(actorOf(req), id, number, req.body as SendBackRequest),
  });
}

async function comment(req: Request, res: Response) {
  const { id, number } = parsedParams<RevisionParams>(req);
  const created = await revisions.addComment(
    actorOf(req),
    id,
    number,
    req.body as ReviewCommentRequest,
  );
  res.status(201).json({ comment: created });
}

async function answered(req: Request, res: Response) {
  const { id, number, commentId } = parsedParams<CommentParams>(req);
  res.json({
    comment: await revisions.markCommentAnswered(actorOf(req), id, number, commentId),
  });
}

/** No route changes a revision's content: any attempt is answered 409, after the usual 404 check. */
async function immutable(req: Request, _res: Response) {
  const { id, number } = parsedParams<RevisionParams>(req);
  await revisions.findRevision(actorOf(req), id, number);
  throw new AppError(
    409,
    'immutable',
    'A revision is a frozen record and cannot be changed. Edit the conversion and submit a new revision.',
  );
}

/** Mounted at /api/conversions. */
export const revisionsRoutes = Router();
revisionsRoutes.get(
  '/:id/revisions',
  authorize('conversion:read'),
  validate({ params: IdParams }),
  list,
);
revisionsRoutes.post(
  '/:id/revisions',
  authorize('revision:submit'),
  validate({ params: IdParams, body: SubmitRevisionRequest }),
  submit,
);
revisionsRoutes.get(
  '/:id/revisions/:number',
  authorize('conversion:read'),
  validate({ params: RevisionParams }),
  get,
);
revisionsRoutes.put(
  '/:id/revisions/:number',
  authorize('conversion:read'),
  validate({ params: RevisionParams }),
  immutable,
);
revisionsRoutes.patch(
  '/:id/revisions/:number',
  authorize('conversion:read'),
  validate({ params: RevisionParams }),
  immutable,
);
revisionsRoutes.delete(
  '/:id/revisions/:number',
  authorize('conversion:read'),
  validate({ params: RevisionParams }),
  immutable,
);
revisionsRoutes.get(
  '/:id/revisions/:number/verify',
  authorize('conversion:read'),
  validate({ params: RevisionParams }),
  verify,
);
revisionsRoutes.post(
  '/:id/revisions/:number/sign-off',
  authorize('revision:review'),
  validate({ params: RevisionParams, body: SignOffRequest }),
  signOff,
);
revisionsRoutes.post(
  '/:id/revisions/:number/send-back',
  authorize('revision:review'),
  validate({ params: RevisionParams, body: SendBackRequest }),
  sendBack,
);
revisionsRoutes.post(
  '/:id/revisions/:number/comments',
  authorize('revision:comment'),
  validate({ params: RevisionParams, body: ReviewCommentRequest }),
  comment,
);
// The builder answers the review: the same right as submitting the next revision.
revisionsRoutes.post(
  '/:id/revisions/:number/comments/:commentId/answered',
  authorize('revision:submit'),
  validate({ params: CommentParams }),
  answered,
);
