import type { Request, Response } from 'express';
import type { CreateUserRequest, UpdateUserRequest } from '#shared/schemas/users.schema.ts';
import type { IdParams } from '#shared/schemas/common.schema.ts';
import { actorOf } from '../../lib/actor.ts';
import { parsedParams } from '../../lib/request.ts';
import * as usersService from './users.service.ts';

export async function list(req: Request, res: Response) {
  res.json({ users: await usersService.listUsers(actorOf(req)) });
}

export async function create(req: Request, res: Response) {
  const user = await usersService.createUser(actorOf(req), req.body as CreateUserRequest);
  res.status(201).json({ user });
}

export async function update(req: Request, res: Response) {
  const { id } = parsedParams<IdParams>(req);
  const user = await usersService.updateUser(actorOf(req), id, req.body as UpdateUserRequest);
  res.json({ user });
}
