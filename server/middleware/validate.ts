import type { RequestHandler } from 'express';
import type { ZodType } from 'zod';

interface RequestSchemas {
  params?: ZodType;
  query?: ZodType;
  body?: ZodType;
}

/**
 * Parses params, query and body with their zod schemas and replaces them with the parsed values;
 * a ZodError goes to the error handler, which answers 400 naming each field.
 */
export function validate(schemas: RequestSchemas): RequestHandler {
  return (req, _res, next) => {
    if (schemas.params) req.params = schemas.params.parse(req.params) as typeof req.params;
    if (schemas.query) {
      const query = schemas.query.parse(req.query);
      // Express 5 exposes req.query through a getter.
      Object.defineProperty(req, 'query', { value: query, writable: true, configurable: true });
    }
    if (schemas.body) req.body = schemas.body.parse(req.body ?? {});
    next();
  };
}
