import type { Finding } from '#shared/schemas/checks.schema.ts';
import { REVISION_STATUS_LABELS, type RevisionStatus } from '#shared/schemas/revisions.schema.ts';
import type { ConversionSnapshot } from '#shared/schemas/snapshot.schema.ts';
import type { PaperSize, SizeUnit } from '#shared/schemas/workshop.schema.ts';

export interface WorksheetSignOff {
  reviewerName: string;
  signedAt: Date | string;
  /** The content hash the reviewer signed (hex SHA-256). */
  hash: string;
  /** The public key whose seal was checked before printing (base64 Ed25519, and its fingerprint). */
  seal?: { publicKey: string; fingerprint: string } | null;
}

export interface WorksheetRevision {
  number: number;
  status: RevisionStatus;
  /** Content hash of the frozen snapshot (hex SHA-256). */
  hash: string;
  signOff: WorksheetSignOff | null;
}

/** Everything the worksheet prints besides the plan itself. */
export interface WorksheetMeta {
  workshopName: string;
  paperSize: PaperSize;
  sizeUnit: SizeUnit;
  /** Added to every new-wire length on the cut list, percent. */
  serviceAllowancePct: number;
  printedAt: Date;
  /** Null for the current draft, which prints marked DRAFT on every page. */
  revision: WorksheetRevision | null;
  /** The check findings to print: run now for a draft, the revision's own for a revision. */
  findings: Finding[];
}

export interface WorksheetInput {
  snapshot: ConversionSnapshot;
  meta: WorksheetMeta;
}

/** "in review": the revision's status as the header prints it. */
export function statusLabel(status: RevisionStatus): string {
  return (
    (REVISION_STATUS_LABELS as Record<string, string | undefined>)[status]?.toLowerCase() ??
    String(status).replace(/_/g, ' ')
  );
}

/** The first 12 hex digits: enough to tell revisions apart on paper. */
export function shortHash(hash: string): string {
  return hash.slice(0, 12);
}

/** "2025-06-01 14:32 UTC": the printed date, the same wherever the server runs. */
export function formatDateTime(value: Date | string): string {
  const date = typeof value === 'string' ? new Date(value) : value;
  if (Number.isNaN(date.getTime())) return String(value);
  return `${date.toISOString().slice(0, 16).replace('T', ' ')} UTC`;
}
