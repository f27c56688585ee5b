import { Op, type Transaction } from 'sequelize';
import { benchPlanItems, carryOver, type CarryRecord, type Rework } from '#shared/domain/bench.ts';
import type { BenchTick } from '#shared/schemas/bench.schema.ts';
import type { ConversionSnapshot } from '#shared/schemas/snapshot.schema.ts';
import { BenchRecord, Conversion, Revision, User } from '../../db/models/index.ts';
import type { Actor } from '../../lib/actor.ts';
import { appLink, queueMail } from '../mail/outbox.service.ts';

const snapshotOf = (r: Revision) => JSON.parse(r.snapshotJson) as ConversionSnapshot;

export function ticksOf(r: BenchRecord): Partial<Record<BenchTick, boolean>> {
  return JSON.parse(r.ticksJson) as Partial<Record<BenchTick, boolean>>;
}

export function reworkOf(r: BenchRecord): Rework | null {
  return r.reworkJson ? (JSON.parse(r.reworkJson) as Rework) : null;
}

export const toCarryRecord = (r: BenchRecord): CarryRecord => ({
  key: r.itemKey,
  ticks: ticksOf(r),
  reading: r.reading,
  note: r.note,
  rework: reworkOf(r),
});

export interface CarrySummary {
  fromRevision: number | null;
  carried: number;
  rework: number;
  removed: number;
  added: number;
}

/**
 * Runs inside the sign-off's transaction: the bench work recorded on the previous signed-off
 * revision carries to this one where the item is unchanged; changed and removed items with work
 * done become rework records with nothing ticked. The old revision's records stay where they are.
 */
export async function carryBenchWork(t: Transaction, revision: Revision): Promise<CarrySummary> {
  const previous = await Revision.findOne({
    where: {
      conversionId: revision.conversionId,
      status: 'signed_off',
      number: { [Op.lt]: revision.number },
    },
    order: [['number', 'DESC']],
    transaction: t,
  });
  const items = benchPlanItems(snapshotOf(revision));
  if (!previous) {
    return { fromRevision: null, carried: 0, rework: 0, removed: 0, added: items.length };
  }
  const old = await BenchRecord.findAll({ where: { revisionId: previous.id }, transaction: t });
  const byKey = new Map(old.map((r) => [r.itemKey, r]));
  const outcome = await carryOver(
    {
      number: previous.number,
      items: benchPlanItems(snapshotOf(previous)),
      records: old.map(toCarryRecord),
    },
    { items },
  );
  const rows = [
    ...outcome.carried.map((c) => {
      const source = byKey.get(c.key)!;
      return {
        revisionId: revision.id,
        itemKey: c.key,
        ticksJson: JSON.stringify(c.ticks),
        reading: c.reading,
        note: c.note,
        carriedFrom: source.carriedFrom ?? previous.number,
        reworkJson: c.rework ? JSON.stringify(c.rework) : null,
        recordedById: source.recordedById,
        recordedByName: source.recordedByName,
      };
    }),
    ...[...outcome.rework, ...outcome.removed].map((r) => ({
      revisionId: revision.id,
      itemKey: r.key,
      ticksJson: '{}',
      reading: null,
      note: '',
      carriedFrom: null,
      reworkJson: JSON.stringify(r.rework),
      recordedById: null,
      recordedByName: 'Carried over at sign-off',
    })),
  ];
  if (rows.length) await BenchRecord.bulkCreate(rows, { transaction: t });
  return {
    fromRevision: previous.number,
    carried: outcome.carried.length,
    rework: outcome.rework.length,
    removed: outcome.removed.length,
    added: outcome.added.length,
  };
}

/** One e-mail per active technician of the workshop: a new revision is what the bench works from. */
export async function noticeToBench(
  t: Transaction,
  actor: Actor,
  revision: Revision,
  carry: CarrySummary,
): Promise<void> {
  const conversion = await Conversion.findByPk(revision.conversionId, { transaction: t });
  if (!conversion) return;
  const technicians = await User.findAll({
    where: { workshopId: actor.workshopId, role: 'technician', active: true },
    transaction: t,
  });
  const work =
    carry.fromRevision == null
      ? 'Nothing has been built from an earlier revision.'
      : [
          `From revision ${carry.fromRevision}: ${carry.carried} ${carry.carried === 1 ? 'record carries' : 'records carry'} over unchanged`,
          `${carry.rework} ${carry.rework === 1 ? 'item needs' : 'items need'} rework`,
          `${carry.removed} to take out`,
          `${carry.added} new`,
        ].join(', ') + '.';
  for (const technician of technicians) {
    await queueMail(t, {
      workshopId: actor.workshopId,
      kind: 'bench_notice',
      to: technician.email,
      subject: `For the bench: ${conversion.name}, revision ${revision.number} signed off`,
      text:
        `${actor.name} signed off revision ${revision.number} of "${conversion.name}". The bench now works from it.\n\n` +
        `${work}\n` +
        (carry.rework + carry.removed > 0
          ? 'Rework is listed first on the bench checklist and must be re-ticked.\n'
          : '') +
        `\nOpen the checklist: ${appLink(`/conversions/${conversion.id}/bench`)}\nContent hash: ${revision.hash}\n\n— Loomwright`,
    });
  }
}
