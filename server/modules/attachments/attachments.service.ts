import { createHash, randomUUID } from 'node:crypto';
import type {
  Attachment as AttachmentDto,
  AttachmentType,
} from '#shared/schemas/attachments.schema.ts';
import { db } from '../../db/index.ts';
import { Attachment, User } from '../../db/models/index.ts';
import type { Actor } from '../../lib/actor.ts';
import { findConnectorInWorkshop } from '../pin-map/connectors.service.ts';
import { AppError, notFound } from '../../lib/errors.ts';
import { fileStore, readVerified } from '../../lib/file-store.ts';
import { logger } from '../../lib/logger.ts';
import { inTransaction } from '../../lib/transaction.ts';
import { displayFileName, type UploadedFile } from '../../lib/upload.ts';
import { recordAudit } from '../audit/audit.service.ts';

const PDF = Buffer.from('%PDF-', 'latin1');
const PNG = Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);
const JPEG = Buffer.from([0xff, 0xd8, 0xff]);

/**
 * The file's type from its first bytes (its "magic number"), never from its name or the type the
 * browser declared: a PDF starts with %PDF-, a PNG with its 8-byte signature, a JPEG with FF D8 FF.
 */
export function sniffType(bytes: Buffer): AttachmentType | null {
  if (bytes.subarray(0, PDF.length).equals(PDF)) return 'application/pdf';
  if (bytes.subarray(0, PNG.length).equals(PNG)) return 'image/png';
  if (bytes.subarray(0, JPEG.length).equals(JPEG)) return 'image/jpeg';
  return null;
}

function describeRefused(bytes: Buffer): string {
  const head = bytes.subarray(0, 512).toString('latin1').trimStart().toLowerCase();
  if (head.startsWith('<svg') || head.includes('<svg')) return 'an SVG drawing';
  if (head.startsWith('<')) return 'HTML or XML text';
  if (bytes.length === 0) return 'empty';
  return 'not a PDF, PNG or JPEG';
}

function toDto(a: Attachment, uploadedBy: string | null): AttachmentDto {
  return {
    id: a.id,
    connectorId: a.connectorId,
    conversionId: a.conversionId,
    fileName: a.fileName,
    contentType: a.contentType,
    sizeBytes: a.sizeBytes,
    sha256: a.sha256,
    uploadedBy,
    createdAt: a.createdAt.toISOString(),
  };
}

/** Stores a reference scan of a connector under a generated UUID, then records it. */
export async function addAttachment(
  actor: Actor,
  connectorId: number,
  file: UploadedFile,
): Promise<AttachmentDto> {
  const connector = await findConnectorInWorkshop(actor, connectorId);
  const contentType = sniffType(file.buffer);
  if (!contentType) {
    throw new AppError(
      415,
      'unsupported_media_type',
      `Only PDF, PNG and JPEG files can be attached; this file is ${describeRefused(file.buffer)}. Nothing was saved.`,
    );
  }
  const storageKey = randomUUID();
  const sha256 = createHash('sha256').update(file.buffer).digest('hex');
  const store = fileStore();
  await store.put(storageKey, file.buffer, contentType);
  try {
    const attachment = await inTransaction(db(), async (t) => {
      const row = await Attachment.create(
        {
          workshopId: actor.workshopId,
          conversionId: connector.conversionId,
          connectorId: connector.id,
          storageKey,
          fileName: displayFileName(file.originalName),
          contentType,
          sizeBytes: file.buffer.length,
          sha256,
          uploadedById: actor.id,
        },
        { transaction: t },
      );
      await recordAudit(t, actor, {
        conversionId: connector.conversionId,
        action: 'create',
        entityType: 'attachment',
        entityId: row.id,
        summary: `Attached ${row.fileName} to connector ${connector.label}`,
        after: { fileName: row.fileName, contentType, sizeBytes: row.sizeBytes, sha256 },
      });
      return row;
    });
    return toDto(attachment, actor.name);
  } catch (err) {
    // The row was not written: do not leave its file behind.
    await store.delete(storageKey).catch((e: unknown) => {
      logger.error({ err: e, storageKey }, 'could not remove an unrecorded upload');
    });
    throw err;
  }
}

export async function listAttachments(actor: Actor, connectorId: number): Promise<AttachmentDto[]> {
  await findConnectorInWorkshop(actor, connectorId);
  const rows = await Attachment.findAll({
    where: { connectorId, workshopId: actor.workshopId },
    order: [['id', 'ASC']],
  });
  const ids = [...new Set(rows.map((r) => r.uploadedById).filter((v): v is number => v != null))];
  const users = ids.length
    ? await User.findAll({ where: { id: ids }, attributes: ['id', 'name'] })
    : [];
  const names = new Map(users.map((u) => [u.id, u.name]));
  return rows.map((r) =>
    toDto(r, r.uploadedById == null ? null : (names.get(r.uploadedById) ?? null)),
  );
}

/** The attachment and its bytes, for a signed-in user of the same workshop (anyone else: 404). */
export async function readAttachment(
  actor: Actor,
  id: number,
): Promise<{ attachment: Attachment; bytes: Buffer }> {
  const attachment = await Attachment.findOne({ where: { id, workshopId: actor.workshopId } });
  if (!attachment) throw notFound('That attachment');
  const bytes = await readVerified(attachment.storageKey, attachment.sha256, {
    entity: 'attachment',
    id,
  });
  if (!bytes) {
    logger.error({ attachmentId: id, storageKey: attachment.storageKey }, 'stored file missing');
    throw notFound('The stored file of that attachment');
  }
  return { attachment, bytes };
}

export async function deleteAttachment(actor: Actor, id: number): Promise<void> {
  const attachment = await inTransaction(db(), async (t) => {
    const row = await Attachment.findOne({
      where: { id, workshopId: actor.workshopId },
      transaction: t,
    });
    if (!row) throw notFound('That attachment');
    await row.destroy({ transaction: t });
    await recordAudit(t, actor, {
      conversionId: row.conversionId,
      action: 'delete',
      entityType: 'attachment',
      entityId: row.id,
      summary: `Removed attachment ${row.fileName}`,
      before: { fileName: row.fileName, sha256: row.sha256 },
    });
    return row;
  });
  // After the commit: a failure here leaves an unreferenced object, never a row without its file.
  await fileStore()
    .delete(attachment.storageKey)
    .catch((err: unknown) => {
      logger.error({ err, storageKey: attachment.storageKey }, 'could not delete a stored file');
    });
}
