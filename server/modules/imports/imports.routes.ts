import { Router } from 'express';
import { IdParams } from '#shared/schemas/common.schema.ts';
import { ImportQuery } from '#shared/schemas/imports.schema.ts';
import { config } from '../../config/runtime.ts';
import { parsedQuery } from '../../lib/request.ts';
import { singleFileUpload } from '../../lib/upload.ts';
import { authorize } from '../../middleware/authorize.ts';
import { validate } from '../../middleware/validate.ts';
import * as controller from './imports.controller.ts';

/**
 * The role check comes before the upload is read: a refused caller's file is never parsed. A kept
 * preview is applied by its id (`?preview=`) with no body at all.
 */
const csvUpload = singleFileUpload({
  maxBytes: () => config().IMPORT_MAX_BYTES,
  fields: 1,
  fileless: (req) => parsedQuery<ImportQuery>(req).preview !== undefined,
});

/** Mounted at /api/connectors. */
export const connectorImportRoutes = Router();
connectorImportRoutes.post(
  '/:id/import',
  authorize('pinmap:write'),
  validate({ params: IdParams, query: ImportQuery }),
  csvUpload,
  controller.importIntoConnector,
);

/** Mounted at /api/conversions. */
export const conversionImportRoutes = Router();
conversionImportRoutes.post(
  '/:id/import',
  authorize('pinmap:write'),
  validate({ params: IdParams, query: ImportQuery }),
  csvUpload,
  controller.importIntoConversion,
);
conversionImportRoutes.get(
  '/:id/pins.csv',
  authorize('conversion:read'),
  validate({ params: IdParams }),
  controller.exportPins,
);

/** Mounted at /api/pinouts. */
export const pinoutRoutes = Router();
pinoutRoutes.get('/template.csv', authorize('conversion:read'), controller.pinoutTemplate);
