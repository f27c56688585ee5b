import { Router, type Request, type Response } from 'express';
import { IdParams } from '#shared/schemas/common.schema.ts';
import { CreateFeedRequest, FeedParams, UpdateFeedRequest } from '#shared/schemas/feeds.schema.ts';
import { actorOf } from '../../lib/actor.ts';
import { sendJsonBody } from '../../lib/cached-json.ts';
import { parsedParams } from '../../lib/request.ts';
import { authorize } from '../../middleware/authorize.ts';
import { validate } from '../../middleware/validate.ts';
import * as feedsService from './feeds.service.ts';

async function list(req: Request, res: Response) {
  const { id } = parsedParams<IdParams>(req);
  await sendJsonBody(req, res, await feedsService.feedListBody(actorOf(req), id));
}

async function get(req: Request, res: Response) {
  const { id, feedId } = parsedParams<FeedParams>(req);
  res.json({ feed: await feedsService.getFeed(actorOf(req), id, feedId) });
}

async function create(req: Request, res: Response) {
  const { id } = parsedParams<IdParams>(req);
  const feed = await feedsService.createFeed(actorOf(req), id, req.body as CreateFeedRequest);
  res.status(201).json({ feed });
}

async function update(req: Request, res: Response) {
  const { id, feedId } = parsedParams<FeedParams>(req);
  res.json({
    feed: await feedsService.updateFeed(actorOf(req), id, feedId, req.body as UpdateFeedRequest),
  });
}

async function remove(req: Request, res: Response) {
  const { id, feedId } = parsedParams<FeedParams>(req);
  await feedsService.deleteFeed(actorOf(req), id, feedId);
  res.status(204).end();
}

/** Mounted at /api/conversions. */
export const feedsRoutes = Router();
feedsRoutes.get('/:id/feeds', authorize('conversion:read'), validate({ params: IdParams }), list);
feedsRoutes.post(
  '/:id/feeds',
  authorize('feed:write'),
  validate({ params: IdParams, body: CreateFeedRequest }),
  create,
);
feedsRoutes.get(
  '/:id/feeds/:feedId',
  authorize('conversion:read'),
  validate({ params: FeedParams }),
  get,
);
feedsRoutes.patch(
  '/:id/feeds/:feedId',
  authorize('feed:write'),
  validate({ params: FeedParams, body: UpdateFeedRequest }),
  update,
);
feedsRoutes.delete(
  '/:id/feeds/:feedId',
  authorize('feed:write'),
  validate({ params: FeedParams }),
  remove,
);
