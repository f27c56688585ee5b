import { z } from 'zod';
import type { CheckReport, Finding } from './checks.schema.ts';
import { IdParam, noteText, requiredText } from './common.schema.ts';
import type { ConversionSnapshot } from './snapshot.schema.ts';

export const REVISION_STATUSES = ['in_review', 'changes_requested', 'signed_off'] as const;
export type RevisionStatus = (typeof REVISION_STATUSES)[number];
export const REVISION_STATUS_LABELS: Record<RevisionStatus, string> = {
  in_review: 'In review',
  changes_requested: 'Changes requested',
  signed_off: 'Signed off',
};

export const RevisionParams = z.strictObject({ id: IdParam, number: IdParam });
export type RevisionParams = z.output<typeof RevisionParams>;

export const CommentParams = z.strictObject({ id: IdParam, number: IdParam, commentId: IdParam });
export type CommentParams = z.output<typeof CommentParams>;

export const SubmitRevisionRequest = z.strictObject({
  /** A line for the reviewer about what changed. */
  note: noteText(2000).optional(),
});
export type SubmitRevisionRequest = z.infer<typeof SubmitRevisionRequest>;

export const SignOffRequest = z.strictObject({
  /** The revision's version the reviewer read; a changed revision is a 409. */
  version: z.number().int().min(0).optional(),
});
export type SignOffRequest = z.infer<typeof SignOffRequest>;

export const SendBackRequest = z.strictObject({
  comment: requiredText(4000, { multiline: true }),
  version: z.number().int().min(0).optional(),
});
export type SendBackRequest = z.infer<typeof SendBackRequest>;

export const ReviewCommentRequest = z
  .strictObject({
    body: requiredText(4000, { multiline: true }),
    pinId: z.number().int().positive().nullable().optional(),
    feedId: z.number().int().positive().nullable().optional(),
  })
  .refine((v) => v.pinId == null || v.feedId == null, {
    message: 'comment on a pin or on a feed, not both',
    path: ['feedId'],
  });
export type ReviewCommentRequest = z.infer<typeof ReviewCommentRequest>;

export interface RevisionSummary {
  number: number;
  status: RevisionStatus;
  hash: string;
  submittedBy: string;
  submittedAt: string;
  reviewedBy: string | null;
  reviewedAt: string | null;
  signedAt: string | null;
  reviewComment: string;
  counts: CheckReport['counts'];
  version: number;
}

export interface ReviewComment {
  id: number;
  authorName: string;
  pinId: number | null;
  feedId: number | null;
  subjectLabel: string;
  body: string;
  createdAt: string;
  /** Marked answered by the builder, or null. */
  answered: { by: string; at: string } | null;
}

/** A comment of an earlier revision on a pin or feed, shown on the later revisions. */
export interface EarlierComment extends ReviewComment {
  revisionNumber: number;
}

export interface RevisionDetail extends RevisionSummary {
  snapshot: ConversionSnapshot;
  findings: Finding[];
  comments: ReviewComment[];
  /** Comments of earlier revisions on the pins and feeds, oldest first, each with its revision. */
  earlierComments: EarlierComment[];
  /** Differences from the last signed-off revision before this one; null for the first. */
  changes: RevisionChanges | null;
  comparedWith: number | null;
  /** The reviewer's decision sealed with the server's Ed25519 key; null while in review. */
  seal: RevisionSeal | null;
}

/** `GET …/verify`: the content hash recomputed, and whether the content and decision match the seal. */
export interface RevisionVerification {
  ok: boolean;
  hash: string;
  storedHash: string;
  /** Decided revisions carry a seal; a revision in review has only its content hash. */
  sealed: boolean;
  /** Why it does not match, or null. */
  problem: string | null;
}

export interface RevisionSeal {
  algorithm: 'Ed25519';
  /** The raw public key, base64. */
  publicKey: string;
  /** The public key's fingerprint in groups of four hex digits, for reading aloud. */
  fingerprint: string;
  /** The signature, base64. */
  signature: string;
}

export interface FieldChange {
  field: string;
  before: unknown;
  after: unknown;
}

/** A pin named in the differences: its cavity name, what it does and the connector it is on. */
export interface ChangedPinRef {
  name: string;
  pinId: number;
  function: string;
  /** "E1, ECU side" */
  connector: string;
}

export interface RevisionChanges {
  pins: {
    added: ChangedPinRef[];
    removed: ChangedPinRef[];
    changed: Array<ChangedPinRef & { fields: FieldChange[] }>;
  };
  feeds: {
    added: Array<{ name: string; feedId: number }>;
    removed: Array<{ name: string; feedId: number }>;
    changed: Array<{ name: string; feedId: number; fields: FieldChange[] }>;
  };
  connectors: {
    added: string[];
    removed: string[];
    changed: Array<{ label: string; fields: FieldChange[] }>;
  };
  conversion: FieldChange[];
  /** Wires, splices, ground points and box positions, matched by label; absent before the harness. */
  harness?: {
    added: string[];
    removed: string[];
    changed: Array<{ label: string; fields: FieldChange[] }>;
  };
}
