/** The file types a reference scan may be; told by the file's first bytes, never by its name. */
export const ATTACHMENT_TYPES = ['application/pdf', 'image/png', 'image/jpeg'] as const;
export type AttachmentType = (typeof ATTACHMENT_TYPES)[number];

export const ATTACHMENT_TYPE_LABELS: Record<AttachmentType, string> = {
  'application/pdf': 'PDF',
  'image/png': 'PNG image',
  'image/jpeg': 'JPEG image',
};

export interface Attachment {
  id: number;
  connectorId: number;
  conversionId: number;
  fileName: string;
  contentType: AttachmentType;
  sizeBytes: number;
  sha256: string;
  uploadedBy: string | null;
  createdAt: string;
}
