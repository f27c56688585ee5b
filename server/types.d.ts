import type { SessionUser } from '#shared/schemas/auth.schema.ts';

declare global {
  namespace Express {
    interface Request {
      /** Set by `authenticate` from the database, not from the token's claims. */
      user?: SessionUser;
      requestId: string;
    }
  }
}

export {};
