import { Router } from 'express';
import { IdParams } from '#shared/schemas/common.schema.ts';
import { config } from '../../config/runtime.ts';
import { singleFileUpload } from '../../lib/upload.ts';
import { authorize } from '../../middleware/authorize.ts';
import { validate } from '../../middleware/validate.ts';
import * as controller from './attachments.controller.ts';

const scanUpload = singleFileUpload({ maxBytes: () => config().ATTACHMENT_MAX_BYTES });

/** Mounted at /api/connectors: a connector's reference scans. */
export const connectorAttachmentRoutes = Router();
connectorAttachmentRoutes.get(
  '/:id/attachments',
  authorize('conversion:read'),
  validate({ params: IdParams }),
  controller.listAttachments,
);
connectorAttachmentRoutes.post(
  '/:id/attachments',
  authorize('attachment:write'),
  validate({ params: IdParams }),
  scanUpload,
  controller.addAttachment,
);

/** Mounted at /api/attachments: downloads go through here, never through a static folder. */
export const attachmentRoutes = Router();
attachmentRoutes.get(
  '/:id',
  authorize('conversion:read'),
  validate({ params: IdParams }),
  controller.downloadAttachment,
);
attachmentRoutes.delete(
  '/:id',
  authorize('attachment:write'),
  validate({ params: IdParams }),
  controller.deleteAttachment,
);
