import { Op, type Transaction } from 'sequelize';
import { countFindings } from '#shared/domain/checks/run-checks.ts';
import { showFinding } from '#shared/domain/checks/finding-sizes.ts';
import {
  canonicalRevisionContent,
  revisionHash,
  sha256Hex,
} from '#shared/domain/revisions/content-hash.ts';
import { cavityName } from '#shared/domain/pin-names.ts';
import { diffSnapshots } from '#shared/domain/revisions/diff.ts';
import type { Finding } from '#shared/schemas/checks.schema.ts';
import {
  REVISION_STATUS_LABELS,
  type EarlierComment,
  type ReviewComment as ReviewCommentDto,
  type ReviewCommentRequest,
  type RevisionDetail,
  type RevisionSummary,
  type SendBackRequest,
  type SignOffRequest,
  type SubmitRevisionRequest,
} from '#shared/schemas/revisions.schema.ts';
import type { ConversionSnapshot } from '#shared/schemas/snapshot.schema.ts';
import { db } from '../../db/index.ts';
import {
  Conversion,
  ReviewComment,
  ReviewCommentAnswer,
  Revision,
  User,
} from '../../db/models/index.ts';
import type { Actor } from '../../lib/actor.ts';
import { AppError, forbidden, notFound, unprocessable } from '../../lib/errors.ts';
import { sealDecision, sealKeyFrom, sealMatches, type SealedDecision } from '../../lib/seal.ts';
import { inTransaction } from '../../lib/transaction.ts';
import { config } from '../../config/runtime.ts';
import { recordAudit } from '../audit/audit.service.ts';
import { carryBenchWork, noticeToBench } from '../bench/bench-carry.service.ts';
import { checkConversion } from '../checks/checks.service.ts';
import { findConversionInWorkshop } from '../conversions/conversions.service.ts';
import { appLink, kickMail, queueMail } from '../mail/outbox.service.ts';
import { getWorkshopSettings } from '../workshop/workshop.service.ts';

const iso = (d: Date | null | undefined) => (d ? new Date(d).toISOString() : null);

/** What a revision froze: the plan as submitted and the findings the checks gave on it. */
export const snapshotOf = (r: Revision) => JSON.parse(r.snapshotJson) as ConversionSnapshot;
/** The findings as frozen: sizes as numbers (finding-sizes.ts); what the hash covers. */
const storedFindingsOf = (r: Revision) => JSON.parse(r.findingsJson) as Finding[];
/** The frozen findings shown in the workshop's unit of today, like every other size beside them. */
async function findingsOf(r: Revision, actor: Pick<Actor, 'workshopId'>): Promise<Finding[]> {
  const { sizeUnit } = await getWorkshopSettings(actor);
  return storedFindingsOf(r).map((f) => showFinding(f, sizeUnit));
}

function toSummary(r: Revision): RevisionSummary {
  return {
    number: r.number,
    status: r.status,
    hash: r.hash,
    submittedBy: r.submittedByName,
    submittedAt: iso(r.submittedAt)!,
    reviewedBy: r.reviewedByName ?? null,
    reviewedAt: iso(r.reviewedAt),
    signedAt: iso(r.signedAt),
    reviewComment: r.reviewComment,
    counts: countFindings(storedFindingsOf(r)),
    version: r.version,
  };
}

const sealKey = () => sealKeyFrom(config().SEAL_PRIVATE_KEY);

/** What a decided revision's seal covers, with the content hash recomputed from its content. */
function decisionOf(r: Revision, contentHash: string): SealedDecision {
  return {
    conversionId: r.conversionId,
    number: r.number,
    contentHash,
    decision: r.status as SealedDecision['decision'],
    reviewerId: r.reviewedById ?? null,
    reviewerName: r.reviewedByName ?? '',
    decidedAt: iso(r.reviewedAt) ?? '',
    submittedByName: r.submittedByName,
    submittedAt: iso(r.submittedAt)!,
  };
}

/** Seals a revision decided outside the review flow (the demo's signed-off revision). */
export function sealOf(r: Revision, sealKeyPem: string): { seal: string; sealKey: string } {
  const key = sealKeyFrom(sealKeyPem);
  return { seal: sealDecision(key, decisionOf(r, r.hash)), sealKey: key.fingerprint };
}

const contentHashOf = (r: Revision) =>
  sha256Hex(canonicalRevisionContent(snapshotOf(r), storedFindingsOf(r)));

/**
 * Whether a revision is what was submitted and, once decided, what its reviewer sealed: the
 * content hash is recomputed from the stored snapshot and findings (never trusted from its column)
 * and the seal checked against it with the public key. Null when intact, else the reason.
 */
async function sealProblem(r: Revision): Promise<string | null> {
  let contentHash: string;
  try {
    contentHash = await contentHashOf(r);
  } catch {
    return 'its stored content cannot be read';
  }
  if (contentHash !== r.hash) return 'its content does not match its content hash';
  if (r.status === 'in_review') return null;
  if (!r.seal) return 'it carries no seal';
  const key = sealKey();
  if (r.sealKey !== key.fingerprint) return 'it was sealed with another key than this server holds';
  if (!sealMatches(key, decisionOf(r, contentHash), r.seal)) {
    return 'its content, reviewer, time or decision differ from what was sealed';
  }
  return null;
}

/** Refuses to serve a revision that does not match its seal: nobody must build from it. */
export async function assertSealIntact(r: Revision): Promise<void> {
  const problem = await sealProblem(r);
  if (problem) {
    throw new AppError(
      409,
      'seal_mismatch',
      `Revision ${r.number} does not match its seal: ${problem}. It may have been changed outside Loomwright, so its content is withheld. Ask your administrator to restore the database from a backup.`,
    );
  }
}

/** The public half of the seal key, shown on the revision page and printed on the worksheet. */
export function sealPublicKey() {
  const key = sealKey();
  return {
    algorithm: 'Ed25519' as const,
    publicKey: key.publicKeyBase64,
    fingerprint: key.fingerprint,
  };
}

const link = (conversionId: number, number: number) =>
  appLink(`/conversions/${conversionId}/revisions/${number}`);

/** Revision `number` of a conversion in the actor's workshop, or 404. */
export async function findRevision(
  actor: Actor,
  conversionId: number,
  number: number,
  t?: Transaction,
): Promise<Revision> {
  await findConversionInWorkshop(actor, conversionId, t);
  const revision = await Revision.findOne({ where: { conversionId, number }, transaction: t });
  if (!revision) throw notFound(`Revision ${number}`);
  return revision;
}

export async function listRevisions(
  actor: Actor,
  conversionId: number,
): Promise<RevisionSummary[]> {
  await findConversionInWorkshop(actor, conversionId);
  const revisions = await Revision.findAll({
    where: { conversionId },
    order: [['number', 'DESC']],
  });
  return revisions.map(toSummary);
}

/**
 * Freezes the plan as revision N for review. Refused with 422 and the reasons while any pin is
 * undecided or any check finding is an error, and with 409 while another revision awaits review.
 */
export async function submitRevision(
  actor: Actor,
  conversionId: number,
  input: SubmitRevisionRequest,
): Promise<RevisionSummary> {
  const summary = await inTransaction(db(), async (t) => {
    const conversion = await findConversionInWorkshop(actor, conversionId, t);
    const waiting = await Revision.findOne({
      where: { conversionId, status: 'in_review' },
      transaction: t,
    });
    if (waiting) {
      throw new AppError(
        409,
        'review_pending',
        `Revision ${waiting.number} is still waiting for review. It must be signed off or sent back before another is submitted.`,
      );
    }
    const {
      snapshot,
      report: { findings },
      stored,
    } = await checkConversion(actor, conversionId, t);
    const errors = findings.filter((f) => f.severity === 'error');
    if (errors.length) {
      throw unprocessable(
        'checks_failed',
        `This plan cannot go for review yet: ${errors.length} ${errors.length === 1 ? 'problem' : 'problems'} must be fixed first.`,
        errors.map((f) => ({ rule: f.rule, message: f.message, subject: f.subject })),
      );
    }
    const last = await Revision.max<number, Revision>('number', {
      where: { conversionId },
      transaction: t,
    });
    const number = (last ?? 0) + 1;
    const hash = await revisionHash(snapshot, stored);
    const now = new Date();
    const revision = await Revision.create(
      {
        conversionId,
        number,
        status: 'in_review',
        snapshotJson: JSON.stringify(snapshot),
        findingsJson: JSON.stringify(stored),
        hash,
        submittedById: actor.id,
        submittedByName: actor.name,
        submittedAt: now,
        reviewComment: input.note ?? '',
      },
      { transaction: t },
    );
    await recordAudit(t, actor, {
      conversionId,
      action: 'submit',
      entityType: 'revision',
      entityId: revision.id,
      summary: `Submitted revision ${number} for review (hash ${hash.slice(0, 12)})`,
      after: { number, hash, warnings: countFindings(findings).warning },
    });
    const reviewers = await User.findAll({
      where: {
        workshopId: actor.workshopId,
        role: 'reviewer',
        active: true,
        id: { [Op.ne]: actor.id },
      },
      transaction: t,
    });
    for (const reviewer of reviewers) {
      await queueMail(t, {
        workshopId: actor.workshopId,
        kind: 'review_requested',
        to: reviewer.email,
        subject: `Review requested: ${conversion.name}, revision ${number}`,
        text:
          `${actor.name} has submitted revision ${number} of "${conversion.name}" (${conversion.donorEngine} into ${conversion.receivingVehicle}) for review.\n\n` +
          (input.note ? `Their note: ${input.note}\n\n` : '') +
          `Open it: ${link(conversionId, number)}\nContent hash: ${hash}\n\n— Loomwright`,
      });
    }
    return toSummary(revision);
  });
  kickMail();
  return summary;
}

async function assertReviewable(actor: Actor, revision: Revision, version: number | undefined) {
  // Separation of duties: nobody reviews their own submission.
  if (revision.submittedById === actor.id) {
    throw forbidden('You submitted this revision; another reviewer must review it.');
  }
  if (revision.status !== 'in_review') {
    throw new AppError(
      409,
      'not_in_review',
      `Revision ${revision.number} is ${REVISION_STATUS_LABELS[revision.status].toLowerCase()}; only a revision in review can be signed off or sent back.`,
    );
  }
  if (version !== undefined && version !== revision.version) {
    throw new AppError(
      409,
      'version_conflict',
      `Revision ${revision.number} changed since you opened it; reload it.`,
    );
  }
}

/**
 * Records a reviewer's decision on a revision in review: one conditional UPDATE (status still in
 * review, version as read), so of two decisions at once exactly one succeeds; then the audit line
 * and the notice to the submitter, in the same transaction. A signed-off revision is then frozen by
 * the database trigger.
 */
async function decide(
  actor: Actor,
  conversionId: number,
  number: number,
  version: number | undefined,
  decision: { status: 'signed_off' } | { status: 'changes_requested'; comment: string },
): Promise<RevisionSummary> {
  const summary = await inTransaction(db(), async (t) => {
    const revision = await findRevision(actor, conversionId, number, t);
    await assertReviewable(actor, revision, version);
    // Never seal content that changed since it was submitted.
    await assertSealIntact(revision);
    const now = new Date();
    const signing = decision.status === 'signed_off';
    const key = sealKey();
    const seal = sealDecision(key, {
      ...decisionOf(revision, revision.hash),
      decision: decision.status,
      reviewerId: actor.id,
      reviewerName: actor.name,
      decidedAt: now.toISOString(),
    });
    const [updated] = await Revision.update(
      {
        status: decision.status,
        reviewedById: actor.id,
        reviewedByName: actor.name,
        reviewedAt: now,
        ...(signing ? { signedAt: now } : { reviewComment: decision.comment }),
        seal,
        sealKey: key.fingerprint,
        version: revision.version + 1,
      },
      {
        where: { id: revision.id, status: 'in_review', version: revision.version },
        transaction: t,
      },
    );
    if (updated !== 1) {
      throw new AppError(
        409,
        'not_in_review',
        `Revision ${number} was reviewed by someone else just now.`,
      );
    }
    await revision.reload({ transaction: t });
    await recordAudit(t, actor, {
      conversionId,
      action: signing ? 'sign_off' : 'send_back',
      entityType: 'revision',
      entityId: revision.id,
      summary: signing
        ? `Signed off revision ${number} (hash ${revision.hash.slice(0, 12)})`
        : `Sent revision ${number} back: ${decision.comment.slice(0, 120)}`,
      after: signing
        ? { number, hash: revision.hash, signedAt: now.toISOString() }
        : { number, comment: decision.comment },
    });
    await notifySubmitter(t, actor, revision, decision.status, signing ? '' : decision.comment);
    if (signing) await noticeToBench(t, actor, revision, await carryBenchWork(t, revision));
    return toSummary(revision);
  });
  kickMail();
  return summary;
}

export function signOff(actor: Actor, conversionId: number, number: number, input: SignOffRequest) {
  return decide(actor, conversionId, number, input.version, { status: 'signed_off' });
}

export function sendBack(
  actor: Actor,
  conversionId: number,
  number: number,
  input: SendBackRequest,
) {
  return decide(actor, conversionId, number, input.version, {
    status: 'changes_requested',
    comment: input.comment,
  });
}

async function notifySubmitter(
  t: Transaction,
  actor: Actor,
  revision: Revision,
  kind: 'signed_off' | 'changes_requested',
  comment: string,
) {
  if (revision.submittedById == null) return;
  const submitter = await User.findByPk(revision.submittedById, { transaction: t });
  const conversion = await Conversion.findByPk(revision.conversionId, { transaction: t });
  if (!submitter || !submitter.active || !conversion) return;
  const what = kind === 'signed_off' ? 'signed off' : 'sent back for changes';
  await queueMail(t, {
    workshopId: actor.workshopId,
    kind,
    to: submitter.email,
    subject: `Revision ${revision.number} of ${conversion.name} ${what}`,
    text:
      `${actor.name} ${what} revision ${revision.number} of "${conversion.name}".\n\n` +
      (comment ? `Their comment: ${comment}\n\n` : '') +
      (kind === 'signed_off'
        ? `It is now the revision the bench works from. Content hash: ${revision.hash}\n\n`
        : '') +
      `Open it: ${link(revision.conversionId, revision.number)}\n\n— Loomwright`,
  });
}

function subjectLabel(snapshot: ConversionSnapshot, input: ReviewCommentRequest): string {
  if (input.pinId != null) {
    const pin = snapshot.pins.find((p) => p.id === input.pinId);
    if (!pin)
      throw new AppError(400, 'validation_failed', 'pinId: not a pin of this revision', [
        { field: 'pinId', message: 'is not a pin of this revision' },
      ]);
    const label = snapshot.connectors.find((c) => c.id === pin.connectorId)?.label ?? '?';
    return cavityName(label, pin.cavity);
  }
  if (input.feedId != null) {
    const feed = snapshot.feeds.find((f) => f.id === input.feedId);
    if (!feed)
      throw new AppError(400, 'validation_failed', 'feedId: not a feed of this revision', [
        { field: 'feedId', message: 'is not a feed of this revision' },
      ]);
    return `Feed: ${feed.name}`;
  }
  return '';
}

function toCommentDto(c: ReviewComment, answer?: ReviewCommentAnswer | null): ReviewCommentDto {
  return {
    id: c.id,
    authorName: c.authorName,
    pinId: c.pinId,
    feedId: c.feedId,
    subjectLabel: c.subjectLabel,
    body: c.body,
    createdAt: iso(c.createdAt)!,
    answered: answer ? { by: answer.answeredByName, at: iso(answer.answeredAt)! } : null,
  };
}

async function answersOf(comments: ReviewComment[]): Promise<Map<number, ReviewCommentAnswer>> {
  if (!comments.length) return new Map();
  const answers = await ReviewCommentAnswer.findAll({
    where: { commentId: comments.map((c) => c.id) },
  });
  return new Map(answers.map((a) => [a.commentId, a]));
}

/**
 * Comments of the revisions before `number` on a pin or a feed: a remark on revision 2 stays in
 * sight on revision 3, with its revision, until the builder marks it answered and after.
 */
async function earlierCommentsOf(conversionId: number, number: number): Promise<EarlierComment[]> {
  const earlier = await Revision.findAll({
    where: { conversionId, number: { [Op.lt]: number } },
    attributes: ['id', 'number'],
  });
  if (!earlier.length) return [];
  const numberOf = new Map(earlier.map((r) => [r.id, r.number]));
  const comments = await ReviewComment.findAll({
    where: {
      revisionId: [...numberOf.keys()],
      [Op.or]: [{ pinId: { [Op.ne]: null } }, { feedId: { [Op.ne]: null } }],
    },
    order: [['id', 'ASC']],
  });
  const answers = await answersOf(comments);
  return comments.map((c) => ({
    ...toCommentDto(c, answers.get(c.id)),
    revisionNumber: numberOf.get(c.revisionId)!,
  }));
}

/** The builder marks a comment of one of the conversion's revisions answered; once is enough. */
export async function markCommentAnswered(
  actor: Actor,
  conversionId: number,
  number: number,
  commentId: number,
): Promise<ReviewCommentDto> {
  return inTransaction(db(), async (t) => {
    await findRevision(actor, conversionId, number, t);
    const comment = await ReviewComment.findByPk(commentId, { transaction: t });
    const of = comment
      ? await Revision.findOne({
          where: { id: comment.revisionId, conversionId },
          attributes: ['id', 'number'],
          transaction: t,
        })
      : null;
    if (!comment || !of) throw notFound('That comment');
    const existing = await ReviewCommentAnswer.findByPk(commentId, { transaction: t });
    if (existing) return toCommentDto(comment, existing);
    const answer = await ReviewCommentAnswer.create(
      {
        commentId,
        answeredById: actor.id,
        answeredByName: actor.name,
        answeredAt: new Date(),
      },
      { transaction: t },
    );
    await recordAudit(t, actor, {
      conversionId,
      action: 'answer_comment',
      entityType: 'revision',
      entityId: of.id,
      summary: `Marked answered ${comment.authorName}'s comment on revision ${of.number}${comment.subjectLabel ? ` (${comment.subjectLabel})` : ''}`,
      after: { commentId },
    });
    return toCommentDto(comment, answer);
  });
}

export async function addComment(
  actor: Actor,
  conversionId: number,
  number: number,
  input: ReviewCommentRequest,
): Promise<ReviewCommentDto> {
  return inTransaction(db(), async (t) => {
    const revision = await findRevision(actor, conversionId, number, t);
    const snapshot = snapshotOf(revision);
    const label = subjectLabel(snapshot, input);
    const comment = await ReviewComment.create(
      {
        revisionId: revision.id,
        authorId: actor.id,
        authorName: actor.name,
        pinId: input.pinId ?? null,
        feedId: input.feedId ?? null,
        subjectLabel: label,
        body: input.body,
      },
      { transaction: t },
    );
    await recordAudit(t, actor, {
      conversionId,
      action: 'comment',
      entityType: 'revision',
      entityId: revision.id,
      summary: `Commented on revision ${number}${label ? ` (${label})` : ''}`,
      after: { body: input.body },
    });
    return toCommentDto(comment);
  });
}

export async function getRevision(
  actor: Actor,
  conversionId: number,
  number: number,
): Promise<RevisionDetail> {
  const revision = await findRevision(actor, conversionId, number);
  await assertSealIntact(revision);
  const snapshot = snapshotOf(revision);
  const comments = await ReviewComment.findAll({
    where: { revisionId: revision.id },
    order: [['id', 'ASC']],
  });
  const previous = await Revision.findOne({
    where: { conversionId, status: 'signed_off', number: { [Op.lt]: number } },
    order: [['number', 'DESC']],
  });
  const answers = await answersOf(comments);
  return {
    ...toSummary(revision),
    snapshot,
    findings: await findingsOf(revision, actor),
    comments: comments.map((c) => toCommentDto(c, answers.get(c.id))),
    earlierComments: await earlierCommentsOf(conversionId, number),
    changes: previous ? diffSnapshots(snapshotOf(previous), snapshot) : null,
    comparedWith: previous?.number ?? null,
    seal: revision.seal ? { ...sealPublicKey(), signature: revision.seal } : null,
  };
}

/** Recomputes the content hash from the stored snapshot and findings, and checks the seal. */
export async function verifyRevision(actor: Actor, conversionId: number, number: number) {
  const revision = await findRevision(actor, conversionId, number);
  const recomputed = await contentHashOf(revision);
  const problem = await sealProblem(revision);
  return {
    ok: problem === null,
    hash: recomputed,
    storedHash: revision.hash,
    sealed: revision.status !== 'in_review',
    problem,
  };
}

/** The revision a worksheet or the bench prints: its frozen snapshot, findings and sign-off. */
export async function revisionForPrint(actor: Actor, conversionId: number, number: number) {
  const revision = await findRevision(actor, conversionId, number);
  await assertSealIntact(revision);
  return {
    revision,
    snapshot: snapshotOf(revision),
    findings: await findingsOf(revision, actor),
    seal: revision.seal ? sealPublicKey() : null,
  };
}

/** The latest signed-off revision: the one technicians work from. */
export async function currentSignedOff(
  actor: Actor,
  conversionId: number,
): Promise<Revision | null> {
  await findConversionInWorkshop(actor, conversionId);
  const revision = await Revision.findOne({
    where: { conversionId, status: 'signed_off' },
    order: [['number', 'DESC']],
  });
  if (revision) await assertSealIntact(revision);
  return revision;
}
