import type { Request } from 'express';

/** The params `validate({ params })` parsed; the cast names the schema's output type once. */
export function parsedParams<T>(req: Request): T {
  return req.params as unknown as T;
}

/** The query `validate({ query })` parsed. */
export function parsedQuery<T>(req: Request): T {
  return req.query as unknown as T;
}
