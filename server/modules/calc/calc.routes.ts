import { Router, type Request, type Response } from 'express';
import { runCircuitCalc } from '#shared/domain/electrical/circuit-calc.ts';
import { CalcRequest } from '#shared/schemas/calc.schema.ts';
import { badRequest } from '../../lib/errors.ts';
import { authorize } from '../../middleware/authorize.ts';
import { validate } from '../../middleware/validate.ts';

function run(req: Request, res: Response) {
  try {
    res.json(runCircuitCalc(req.body as CalcRequest));
  } catch (err) {
    // The library refuses impossible inputs the schema let through with a RangeError that says why.
    if (err instanceof RangeError) throw badRequest(err.message);
    throw err;
  }
}

/** Mounted at /api/calc: the stateless calculator for the feed form, what-ifs and scripts. */
export const calcRoutes = Router();
calcRoutes.post('/run', authorize('calc:use'), validate({ body: CalcRequest }), run);
