import type {
  BenchRecord as BenchRecordDto,
  BenchRecordRequest,
  BenchSheet,
} from '#shared/schemas/bench.schema.ts';
import { benchItems } from '#shared/domain/bench.ts';
import { cavityName } from '#shared/domain/pin-names.ts';
import { db } from '../../db/index.ts';
import { BenchRecord } from '../../db/models/index.ts';
import type { Actor } from '../../lib/actor.ts';
import { AppError, notFound, versionConflict } from '../../lib/errors.ts';
import { inTransaction } from '../../lib/transaction.ts';
import { recordAudit } from '../audit/audit.service.ts';
import { currentSignedOff, findRevision, snapshotOf } from '../revisions/revisions.service.ts';

function toRecordDto(r: BenchRecord): BenchRecordDto {
  return {
    pinId: r.pinId,
    done: r.done,
    tested: r.tested,
    resistanceOhm: r.resistanceOhm,
    note: r.note,
    recordedBy: r.recordedByName,
    recordedAt: new Date(r.updatedAt).toISOString(),
    version: r.version,
  };
}

/** The checklist of the revision the bench works from: the latest signed-off one. */
export async function getBenchSheet(actor: Actor, conversionId: number): Promise<BenchSheet> {
  const revision = await currentSignedOff(actor, conversionId);
  if (!revision) return { revision: null, items: [], progress: { total: 0, done: 0, tested: 0 } };
  const snapshot = snapshotOf(revision);
  const records = new Map(
    (await BenchRecord.findAll({ where: { revisionId: revision.id } })).map((r) => [
      r.pinId,
      toRecordDto(r),
    ]),
  );
  const items = benchItems(snapshot).map((item) => ({
    ...item,
    record: records.get(item.pin.id) ?? null,
  }));
  return {
    revision: {
      number: revision.number,
      hash: revision.hash,
      signedAt: new Date(revision.signedAt!).toISOString(),
      reviewedBy: revision.reviewedByName ?? '',
    },
    items,
    progress: {
      total: items.length,
      done: items.filter((i) => i.record?.done).length,
      tested: items.filter((i) => i.record?.tested).length,
    },
  };
}

/** Records one pin's bench work against a signed-off revision, with the usual version check. */
export async function recordBenchWork(
  actor: Actor,
  conversionId: number,
  number: number,
  pinId: number,
  input: BenchRecordRequest,
): Promise<BenchRecordDto> {
  return inTransaction(db(), async (t) => {
    const revision = await findRevision(actor, conversionId, number, t);
    if (revision.status !== 'signed_off') {
      throw new AppError(
        409,
        'not_signed_off',
        `Revision ${number} is not signed off: the bench works only from a signed-off revision.`,
      );
    }
    const snapshot = snapshotOf(revision);
    const pin = snapshot.pins.find((p) => p.id === pinId);
    if (!pin) throw notFound('That pin in this revision');
    const existing = await BenchRecord.findOne({
      where: { revisionId: revision.id, pinId },
      transaction: t,
    });
    if ((existing?.version ?? null) !== input.version) {
      throw versionConflict(existing ? toRecordDto(existing) : null);
    }
    const { version: _version, ...fields } = input;
    const record =
      existing ??
      BenchRecord.build({ revisionId: revision.id, pinId, recordedByName: actor.name, ...fields });
    record.set({ ...fields, recordedById: actor.id, recordedByName: actor.name });
    const before = existing ? toRecordDto(existing) : null;
    await record.save({ transaction: t });
    const label = snapshot.connectors.find((c) => c.id === pin.connectorId)?.label ?? '?';
    await recordAudit(t, actor, {
      conversionId,
      action: 'bench_record',
      entityType: 'pin',
      entityId: pinId,
      summary: `Bench, revision ${number}, ${cavityName(label, pin.cavity)}: ${[fields.done && 'done', fields.tested && 'tested', fields.resistanceOhm != null && `${fields.resistanceOhm} Ω`].filter(Boolean).join(', ') || 'cleared'}`,
      before,
      after: fields,
    });
    return toRecordDto(record);
  });
}
