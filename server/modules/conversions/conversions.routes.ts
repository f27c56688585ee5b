import { Router } from 'express';
import { IdParams } from '#shared/schemas/common.schema.ts';
import {
  CreateConversionRequest,
  UpdateConversionRequest,
} from '#shared/schemas/conversions.schema.ts';
import { authorize } from '../../middleware/authorize.ts';
import { validate } from '../../middleware/validate.ts';
import * as controller from './conversions.controller.ts';

export const conversionsRoutes = Router();
conversionsRoutes.get('/', authorize('conversion:read'), controller.list);
conversionsRoutes.post(
  '/',
  authorize('conversion:write'),
  validate({ body: CreateConversionRequest }),
  controller.create,
);
conversionsRoutes.get(
  '/:id',
  authorize('conversion:read'),
  validate({ params: IdParams }),
  controller.get,
);
conversionsRoutes.patch(
  '/:id',
  authorize('conversion:write'),
  validate({ params: IdParams, body: UpdateConversionRequest }),
  controller.update,
);
