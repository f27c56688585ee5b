import { Router } from 'express';
import { IdParams } from '#shared/schemas/common.schema.ts';
import {
  BatchPinRequest,
  BulkPinRequest,
  CreateConnectorRequest,
  UpdateConnectorRequest,
  UpdatePinRequest,
} from '#shared/schemas/pin-map.schema.ts';
import { authorize } from '../../middleware/authorize.ts';
import { validate } from '../../middleware/validate.ts';
import * as controller from './pin-map.controller.ts';

/** Mounted at /api/conversions: a conversion's connectors and pins. */
export const conversionPinMapRoutes = Router();
conversionPinMapRoutes.get(
  '/:id/connectors',
  authorize('conversion:read'),
  validate({ params: IdParams }),
  controller.listConnectors,
);
conversionPinMapRoutes.post(
  '/:id/connectors',
  authorize('pinmap:write'),
  validate({ params: IdParams, body: CreateConnectorRequest }),
  controller.createConnector,
);
conversionPinMapRoutes.get(
  '/:id/pins',
  authorize('conversion:read'),
  validate({ params: IdParams }),
  controller.listPins,
);
conversionPinMapRoutes.post(
  '/:id/pins/bulk',
  authorize('pinmap:write'),
  validate({ params: IdParams, body: BulkPinRequest }),
  controller.bulkUpdatePins,
);
conversionPinMapRoutes.post(
  '/:id/pins/batch',
  authorize('pinmap:write'),
  validate({ params: IdParams, body: BatchPinRequest }),
  controller.batchUpdatePins,
);

/** Mounted at /api/connectors. */
export const connectorRoutes = Router();
connectorRoutes.patch(
  '/:id',
  authorize('pinmap:write'),
  validate({ params: IdParams, body: UpdateConnectorRequest }),
  controller.updateConnector,
);
connectorRoutes.delete(
  '/:id',
  authorize('pinmap:write'),
  validate({ params: IdParams }),
  controller.deleteConnector,
);

/** Mounted at /api/pins. */
export const pinRoutes = Router();
pinRoutes.patch(
  '/:id',
  authorize('pinmap:write'),
  validate({ params: IdParams, body: UpdatePinRequest }),
  controller.updatePin,
);
