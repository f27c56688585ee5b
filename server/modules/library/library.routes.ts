import { Router } from 'express';
import { IdParams } from '#shared/schemas/common.schema.ts';
import {
  ConnectorFromTemplateRequest,
  SaveTemplateRequest,
} from '#shared/schemas/library.schema.ts';
import { authorize } from '../../middleware/authorize.ts';
import { validate } from '../../middleware/validate.ts';
import * as controller from './library.controller.ts';

/** Mounted at /api/library: the workshop's pinout templates and the built-in ones. */
export const libraryRoutes = Router();
libraryRoutes.get('/templates', authorize('library:read'), controller.listTemplates);
libraryRoutes.get(
  '/templates/:id',
  authorize('library:read'),
  validate({ params: IdParams }),
  controller.getTemplate,
);
libraryRoutes.post(
  '/templates',
  authorize('library:write'),
  validate({ body: SaveTemplateRequest }),
  controller.saveTemplate,
);
libraryRoutes.delete(
  '/templates/:id',
  authorize('library:write'),
  validate({ params: IdParams }),
  controller.deleteTemplate,
);

/** Mounted at /api/conversions: a connector started from a template writes the pin map. */
export const conversionLibraryRoutes = Router();
conversionLibraryRoutes.post(
  '/:id/connectors/from-template',
  authorize('pinmap:write'),
  validate({ params: IdParams, body: ConnectorFromTemplateRequest }),
  controller.connectorFromTemplate,
);
