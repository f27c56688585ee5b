import type { Request } from 'express';
import type { SessionUser } from '#shared/schemas/auth.schema.ts';
import { unauthenticated } from './errors.ts';

/** The signed-in person a service acts for, with the request id for the audit trail. */
export interface Actor extends SessionUser {
  requestId: string;
}

export function actorOf(req: Request): Actor {
  if (!req.user) throw unauthenticated();
  return { ...req.user, requestId: req.requestId };
}
