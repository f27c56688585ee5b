import { QueryTypes } from 'sequelize';
import { can } from '#shared/auth/roles.ts';
import type { ConversionListItem, ConversionState } from '#shared/schemas/conversions.schema.ts';
import type { RevisionStatus } from '#shared/schemas/revisions.schema.ts';
import { storedTime } from '../../db/fast-read.ts';
import { db } from '../../db/index.ts';
import type { Actor } from '../../lib/actor.ts';

export type Standing = Pick<
  ConversionListItem,
  'state' | 'latestRevision' | 'lastChangeAt' | 'waitingForYou'
>;

// Every table whose rows a person changes while working on a conversion. The audit trail is in
// the list too: a deleted pin or feed leaves no row to date it, but it leaves an audit event.
const ofTable = (table: string, column = 'updated_at') =>
  `SELECT conversion_id AS id, MAX(${column}) AS at FROM ${table}
    WHERE conversion_id IN (:ids) GROUP BY conversion_id`;
const LAST_CHANGES = [
  ofTable('connectors'),
  ofTable('pins'),
  ofTable('feeds'),
  ofTable('revisions'),
  `SELECT r.conversion_id AS id, MAX(b.updated_at) AS at FROM bench_records b
    JOIN revisions r ON r.id = b.revision_id
    WHERE r.conversion_id IN (:ids) GROUP BY r.conversion_id`,
  ofTable('audit_events', 'created_at'),
].join(' UNION ALL ');

/**
 * Where each conversion of the actor's workshop stands: the state of its latest revision, when
 * anything in it last changed, and whether it waits for this reader's review.
 */
export async function conversionStandings(
  actor: Actor,
  conversions: Array<{ id: number; updatedAt: string }>,
): Promise<Map<number, Standing>> {
  const ids = conversions.map((c) => c.id);
  if (ids.length === 0) return new Map();
  const sequelize = db();
  const [changes, revisions] = await Promise.all([
    sequelize.query<{ id: number; at: unknown }>(LAST_CHANGES, {
      replacements: { ids },
      type: QueryTypes.SELECT,
      raw: true,
    }),
    sequelize.query<{
      conversionId: number;
      number: number;
      status: RevisionStatus;
      submittedById: number | null;
      submittedByName: string;
    }>(
      `SELECT conversion_id AS "conversionId", number, status,
              submitted_by_id AS "submittedById", submitted_by_name AS "submittedByName"
         FROM revisions WHERE conversion_id IN (:ids) ORDER BY number DESC`,
      { replacements: { ids }, type: QueryTypes.SELECT, raw: true },
    ),
  ]);
  const last = new Map<number, number>();
  for (const c of conversions) last.set(c.id, storedTime(c.updatedAt));
  for (const row of changes) {
    const at = storedTime(row.at);
    if (last.has(row.id) && at > last.get(row.id)!) last.set(row.id, at);
  }
  const latest = new Map<number, (typeof revisions)[number]>();
  for (const r of revisions) if (!latest.has(r.conversionId)) latest.set(r.conversionId, r);
  const mayReview = can(actor.role, 'revision:review');
  const standings = new Map<number, Standing>();
  for (const id of ids) {
    const revision = latest.get(id);
    const state: ConversionState = revision?.status ?? 'draft';
    standings.set(id, {
      state,
      latestRevision: revision
        ? {
            number: revision.number,
            status: revision.status,
            submittedBy: revision.submittedByName,
          }
        : null,
      lastChangeAt: new Date(last.get(id)!).toISOString(),
      // Nobody reviews their own submission (the review service refuses it too).
      waitingForYou: mayReview && state === 'in_review' && revision?.submittedById !== actor.id,
    });
  }
  return standings;
}
