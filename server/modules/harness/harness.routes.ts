import { Router, type Request, type Response } from 'express';
import { z } from 'zod';
import { IdParam, IdParams } from '#shared/schemas/common.schema.ts';
import {
  CircuitParams,
  CreateBoxRequest,
  CreateGroundPointRequest,
  CreateSpliceRequest,
  CreateWireRequest,
  UpdateBoxRequest,
  UpdateGroundPointRequest,
  UpdateSpliceRequest,
  UpdateWireRequest,
} from '#shared/schemas/harness.schema.ts';
import { actorOf } from '../../lib/actor.ts';
import { sendJsonBody } from '../../lib/cached-json.ts';
import { parsedParams } from '../../lib/request.ts';
import { authorize } from '../../middleware/authorize.ts';
import { validate } from '../../middleware/validate.ts';
import * as circuits from './circuits.service.ts';
import * as harness from './harness.service.ts';
import * as wireCsv from './wire-csv.service.ts';

const ItemParams = z.strictObject({ id: IdParam, itemId: IdParam });
type ItemParams = z.output<typeof ItemParams>;

/** Mounted at /api/conversions: the harness of one conversion. */
export const conversionHarnessRoutes = Router();
const read = authorize('conversion:read');
const write = authorize('pinmap:write');

conversionHarnessRoutes.get(
  '/:id/wires',
  read,
  validate({ params: IdParams }),
  async (req, res) => {
    const { id } = parsedParams<IdParams>(req);
    await sendJsonBody(req, res, await harness.wireListBody(actorOf(req), id));
  },
);
conversionHarnessRoutes.post(
  '/:id/wires',
  write,
  validate({ params: IdParams, body: CreateWireRequest }),
  async (req, res) => {
    const { id } = parsedParams<IdParams>(req);
    const wire = await harness.createWire(actorOf(req), id, req.body as CreateWireRequest);
    res.status(201).json({ wire });
  },
);
conversionHarnessRoutes.get(
  '/:id/wires.csv',
  read,
  validate({ params: IdParams }),
  async (req: Request, res: Response) => {
    const { id } = parsedParams<IdParams>(req);
    const { fileName, text } = await wireCsv.exportWires(actorOf(req), id);
    res.type('text/csv; charset=utf-8');
    res.setHeader('Content-Disposition', `attachment; filename="${fileName}"`);
    res.send(`\uFEFF${text}`);
  },
);
conversionHarnessRoutes.post(
  '/:id/wires/import',
  write,
  wireCsv.uploadOne,
  validate({ params: IdParams }),
  async (req, res) => {
    const { id } = parsedParams<IdParams>(req);
    const dryRun = req.query.dryRun === '1' || req.query.dryRun === 'true';
    const result = await wireCsv.importWires(actorOf(req), id, req.file?.buffer, dryRun);
    res.status(result.errors.length ? 422 : 200).json(result);
  },
);

conversionHarnessRoutes.get(
  '/:id/splices',
  read,
  validate({ params: IdParams }),
  async (req, res) => {
    const { id } = parsedParams<IdParams>(req);
    res.json({ splices: await harness.listSplices(actorOf(req), id) });
  },
);
conversionHarnessRoutes.post(
  '/:id/splices',
  write,
  validate({ params: IdParams, body: CreateSpliceRequest }),
  async (req, res) => {
    const { id } = parsedParams<IdParams>(req);
    const splice = await harness.createSplice(actorOf(req), id, req.body as CreateSpliceRequest);
    res.status(201).json({ splice });
  },
);
conversionHarnessRoutes.patch(
  '/:id/splices/:itemId',
  write,
  validate({ params: ItemParams, body: UpdateSpliceRequest }),
  async (req, res) => {
    const { id, itemId } = parsedParams<ItemParams>(req);
    res.json({
      splice: await harness.updateSplice(actorOf(req), id, itemId, req.body as UpdateSpliceRequest),
    });
  },
);

conversionHarnessRoutes.delete(
  '/:id/splices/:itemId',
  write,
  validate({ params: ItemParams }),
  async (req, res) => {
    const { id, itemId } = parsedParams<ItemParams>(req);
    await harness.deleteSplice(actorOf(req), id, itemId);
    res.status(204).end();
  },
);

conversionHarnessRoutes.get(
  '/:id/ground-points',
  read,
  validate({ params: IdParams }),
  async (req, res) => {
    const { id } = parsedParams<IdParams>(req);
    res.json({ groundPoints: await harness.listGroundPoints(actorOf(req), id) });
  },
);
conversionHarnessRoutes.post(
  '/:id/ground-points',
  write,
  validate({ params: IdParams, body: CreateGroundPointRequest }),
  async (req, res) => {
    const { id } = parsedParams<IdParams>(req);
    const groundPoint = await harness.createGroundPoint(
      actorOf(req),
      id,
      req.body as CreateGroundPointRequest,
    );
    res.status(201).json({ groundPoint });
  },
);
conversionHarnessRoutes.patch(
  '/:id/ground-points/:itemId',
  write,
  validate({ params: ItemParams, body: UpdateGroundPointRequest }),
  async (req, res) => {
    const { id, itemId } = parsedParams<ItemParams>(req);
    res.json({
      groundPoint: await harness.updateGroundPoint(
        actorOf(req),
        id,
        itemId,
        req.body as UpdateGroundPointRequest,
      ),
    });
  },
);
conversionHarnessRoutes.delete(
  '/:id/ground-points/:itemId',
  write,
  validate({ params: ItemParams }),
  async (req, res) => {
    const { id, itemId } = parsedParams<ItemParams>(req);
    await harness.deleteGroundPoint(actorOf(req), id, itemId);
    res.status(204).end();
  },
);

conversionHarnessRoutes.get(
  '/:id/boxes',
  read,
  validate({ params: IdParams }),
  async (req, res) => {
    const { id } = parsedParams<IdParams>(req);
    res.json({ boxes: await harness.listBoxes(actorOf(req), id) });
  },
);
conversionHarnessRoutes.post(
  '/:id/boxes',
  write,
  validate({ params: IdParams, body: CreateBoxRequest }),
  async (req, res) => {
    const { id } = parsedParams<IdParams>(req);
    const box = await harness.createBox(actorOf(req), id, req.body as CreateBoxRequest);
    res.status(201).json({ box });
  },
);
conversionHarnessRoutes.patch(
  '/:id/boxes/:itemId',
  write,
  validate({ params: ItemParams, body: UpdateBoxRequest }),
  async (req, res) => {
    const { id, itemId } = parsedParams<ItemParams>(req);
    res.json({
      box: await harness.updateBox(actorOf(req), id, itemId, req.body as UpdateBoxRequest),
    });
  },
);

// Express 5 path syntax: the ".svg" is literal after the named parameter.
conversionHarnessRoutes.get(
  '/:id/circuits/feed/:refId.svg',
  read,
  validate({ params: CircuitParams }),
  async (req, res) => {
    const { id, refId } = parsedParams<CircuitParams>(req);
    res.type('image/svg+xml').send(await circuits.feedCircuitSvg(actorOf(req), id, refId));
  },
);
conversionHarnessRoutes.get(
  '/:id/circuits/pin/:refId.svg',
  read,
  validate({ params: CircuitParams }),
  async (req, res) => {
    const { id, refId } = parsedParams<CircuitParams>(req);
    res.type('image/svg+xml').send(await circuits.pinCircuitSvg(actorOf(req), id, refId));
  },
);

/** Mounted at /api/wires: one wire by its id. */
export const wireRoutes = Router();
wireRoutes.patch(
  '/:id',
  write,
  validate({ params: IdParams, body: UpdateWireRequest }),
  async (req, res) => {
    const { id } = parsedParams<IdParams>(req);
    res.json({ wire: await harness.updateWire(actorOf(req), id, req.body as UpdateWireRequest) });
  },
);
wireRoutes.delete('/:id', write, validate({ params: IdParams }), async (req, res) => {
  const { id } = parsedParams<IdParams>(req);
  await harness.deleteWire(actorOf(req), id);
  res.status(204).end();
});
