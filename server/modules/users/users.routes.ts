import { Router } from 'express';
import { IdParams } from '#shared/schemas/common.schema.ts';
import { CreateUserRequest, UpdateUserRequest } from '#shared/schemas/users.schema.ts';
import { authorize } from '../../middleware/authorize.ts';
import { validate } from '../../middleware/validate.ts';
import * as controller from './users.controller.ts';

export const usersRoutes = Router();
usersRoutes.get('/', authorize('users:manage'), controller.list);
usersRoutes.post(
  '/',
  authorize('users:manage'),
  validate({ body: CreateUserRequest }),
  controller.create,
);
usersRoutes.patch(
  '/:id',
  authorize('users:manage'),
  validate({ params: IdParams, body: UpdateUserRequest }),
  controller.update,
);
