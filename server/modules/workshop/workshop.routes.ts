import { Router, type Request, type Response } from 'express';
import { UpdateWorkshopRequest } from '#shared/schemas/workshop.schema.ts';
import { actorOf } from '../../lib/actor.ts';
import { authorize } from '../../middleware/authorize.ts';
import { validate } from '../../middleware/validate.ts';
import * as workshopService from './workshop.service.ts';

async function get(req: Request, res: Response) {
  res.json({ workshop: await workshopService.getWorkshopSettings(actorOf(req)) });
}

async function update(req: Request, res: Response) {
  const workshop = await workshopService.updateWorkshopSettings(
    actorOf(req),
    req.body as UpdateWorkshopRequest,
  );
  res.json({ workshop });
}

export const workshopRoutes = Router();
// Every role reads the settings: units, paper size and voltage shape every screen.
workshopRoutes.get('/', authorize('conversion:read'), get);
workshopRoutes.patch(
  '/',
  authorize('workshop:settings'),
  validate({ body: UpdateWorkshopRequest }),
  update,
);
