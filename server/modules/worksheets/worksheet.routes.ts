import { Router } from 'express';
import { IdParams } from '#shared/schemas/common.schema.ts';
import { RevisionParams } from '#shared/schemas/revisions.schema.ts';
import { authorize } from '../../middleware/authorize.ts';
import { validate } from '../../middleware/validate.ts';
import { draftWorksheet, revisionWorksheet } from './worksheet.controller.ts';

/** Mounted at /api/conversions. Every role prints worksheets: printing changes nothing. */
export const worksheetRoutes = Router();
worksheetRoutes.get(
  '/:id/worksheet.pdf',
  authorize('worksheet:print'),
  validate({ params: IdParams }),
  draftWorksheet,
);
worksheetRoutes.get(
  '/:id/revisions/:number/worksheet.pdf',
  authorize('worksheet:print'),
  validate({ params: RevisionParams }),
  revisionWorksheet,
);
