import { createHash, randomUUID } from 'node:crypto';
import { Op, type Transaction } from 'sequelize';
import {
  benchPlanItems,
  isDone,
  isTested,
  REMOVED_TICKS,
  type BenchPlanItem,
} from '#shared/domain/bench.ts';
import { buildTestPlan, judgeStep } from '#shared/domain/test-plan.ts';
import type {
  BenchItem,
  BenchNotice,
  BenchPhoto as BenchPhotoDto,
  BenchRecord as BenchRecordDto,
  BenchRecordRequest,
  BenchSheet,
  BenchTickDef,
} from '#shared/schemas/bench.schema.ts';
import type { ConversionSnapshot } from '#shared/schemas/snapshot.schema.ts';
import type { TestPlanResponse, TestResult } from '#shared/schemas/test-plan.schema.ts';
import { db } from '../../db/index.ts';
import { BenchPhoto, BenchRecord, Conversion, Revision } from '../../db/models/index.ts';
import type { Actor } from '../../lib/actor.ts';
import { AppError, notFound, unprocessable, versionConflict } from '../../lib/errors.ts';
import { fileStore, readVerified } from '../../lib/file-store.ts';
import { logger } from '../../lib/logger.ts';
import { inTransaction } from '../../lib/transaction.ts';
import { displayFileName, type UploadedFile } from '../../lib/upload.ts';
import { sniffType } from '../attachments/attachments.service.ts';
import { recordAudit } from '../audit/audit.service.ts';
import { assertSealIntact, findRevision, snapshotOf } from '../revisions/revisions.service.ts';
import { findConversionInWorkshop } from '../conversions/conversions.service.ts';
import { reworkOf, ticksOf } from './bench-carry.service.ts';
import { readTogether } from '../../db/portable.ts';

const iso = (d: Date) => new Date(d).toISOString();

function toPhotoDto(p: BenchPhoto): BenchPhotoDto {
  return { id: p.id, fileName: p.fileName, takenBy: p.takenByName, createdAt: iso(p.createdAt) };
}

function toRecordDto(r: BenchRecord): BenchRecordDto {
  return {
    key: r.itemKey,
    ticks: ticksOf(r),
    reading: r.reading,
    note: r.note,
    recordedBy: r.recordedByName,
    recordedAt: iso(r.updatedAt),
    version: r.version,
    carriedFrom: r.carriedFrom,
    rework: reworkOf(r),
  };
}

/** The latest signed-off revision of a conversion: the one the bench works from. */
async function latestSignedOff(conversionId: number, t?: Transaction) {
  return Revision.findOne({
    where: { conversionId, status: 'signed_off' },
    order: [['number', 'DESC']],
    transaction: t,
  });
}

/** A signed-off revision of the actor's workshop, and whether the bench still works from it. */
async function signedOffRevision(
  actor: Actor,
  conversionId: number,
  number: number | null,
  t?: Transaction,
): Promise<{ revision: Revision; current: boolean } | null> {
  await findConversionInWorkshop(actor, conversionId, t);
  const latest = await latestSignedOff(conversionId, t);
  if (number == null) {
    // Nobody builds from a revision that no longer matches its seal.
    if (latest) await assertSealIntact(latest);
    return latest ? { revision: latest, current: true } : null;
  }
  const revision = await findRevision(actor, conversionId, number, t);
  if (revision.status !== 'signed_off') {
    throw new AppError(
      409,
      'not_signed_off',
      `Revision ${number} is not signed off: the bench works only from a signed-off revision.`,
    );
  }
  await assertSealIntact(revision);
  return { revision, current: latest?.id === revision.id };
}

async function recordsOf(revisionId: number, t?: Transaction) {
  const [records, photos] = await readTogether(
    t,
    () => BenchRecord.findAll({ where: { revisionId }, transaction: t }),
    () => BenchPhoto.findAll({ where: { revisionId }, order: [['id', 'ASC']], transaction: t }),
  );
  const photosByKey: Record<string, BenchPhotoDto[]> = {};
  for (const p of photos) (photosByKey[p.itemKey] ??= []).push(toPhotoDto(p));
  return {
    records: new Map(records.map((r) => [r.itemKey, toRecordDto(r)])),
    photos: photosByKey,
  };
}

/**
 * The checklist of a signed-off revision (the latest when `number` is null): rework first, then
 * removed items to take out, then the rest in bench order. An older revision stays readable.
 */
export async function getBenchSheet(
  actor: Actor,
  conversionId: number,
  number: number | null = null,
): Promise<BenchSheet> {
  const found = await signedOffRevision(actor, conversionId, number);
  if (!found) {
    return {
      revision: null,
      rework: [],
      removed: [],
      items: [],
      progress: { total: 0, done: 0, tested: 0, rework: 0 },
      photos: {},
    };
  }
  const { revision, current } = found;
  const { records, photos } = await recordsOf(revision.id);
  const all: BenchItem[] = benchPlanItems(snapshotOf(revision)).map(
    ({ content: _content, ...item }) => ({ ...item, record: records.get(item.key) ?? null }),
  );
  const planKeys = new Set(all.map((i) => i.key));
  const rework = all.filter((i) => i.record?.rework);
  const removed = [...records.values()]
    .filter((r) => r.rework?.removed && !planKeys.has(r.key))
    .map((record) => ({ key: record.key, rework: record.rework!, record }));
  return {
    revision: {
      number: revision.number,
      hash: revision.hash,
      signedAt: iso(revision.signedAt!),
      reviewedBy: revision.reviewedByName ?? '',
      current,
    },
    rework,
    removed,
    items: all.filter((i) => !i.record?.rework),
    progress: {
      total: all.length,
      done: all.filter((i) => isDone(i, i.record?.ticks)).length,
      tested: all.filter((i) => isTested(i, i.record?.ticks)).length,
      rework:
        rework.filter((i) => !isDone(i, i.record?.ticks)).length +
        removed.filter((r) => !r.record.ticks.done).length,
    },
    photos,
  };
}

/** What a key names in a revision: its ticks and whether it takes a reading. */
interface Target {
  name: string;
  ticks: BenchTickDef[];
  takesReading: boolean;
}

const CHECK_TICKS: BenchTickDef[] = [
  { key: 'passed', label: 'Pass' },
  { key: 'failed', label: 'Fail' },
];

function targetOf(
  snapshot: ConversionSnapshot,
  key: string,
  removedRecord: BenchRecord | null,
): Target | null {
  const item: BenchPlanItem | undefined = benchPlanItems(snapshot).find((i) => i.key === key);
  if (item) return { name: item.name, ticks: item.ticks, takesReading: item.reading !== null };
  const step = buildTestPlan(snapshot).steps.find((s) => s.key === key);
  if (step) {
    return {
      name: `${step.subject}: ${step.what}`,
      ticks: step.unit === 'check' ? CHECK_TICKS : [],
      takesReading: step.unit !== 'check',
    };
  }
  if (removedRecord && reworkOf(removedRecord)?.removed) {
    return { name: reworkOf(removedRecord)!.name, ticks: REMOVED_TICKS, takesReading: false };
  }
  return null;
}

/**
 * Records the bench work on one item or test step of the revision the bench works from, with the
 * usual version check. Work sent for a revision that has since been superseded is refused (409)
 * rather than saved where nobody will look.
 */
export async function recordBenchWork(
  actor: Actor,
  conversionId: number,
  number: number,
  key: string,
  input: BenchRecordRequest,
): Promise<BenchRecordDto> {
  return inTransaction(db(), async (t) => {
    const { revision, current } = (await signedOffRevision(actor, conversionId, number, t))!;
    if (!current) {
      const latest = await latestSignedOff(conversionId, t);
      throw new AppError(
        409,
        'superseded',
        `Revision ${latest!.number} was signed off after revision ${number}: this was not saved. The bench now works from revision ${latest!.number}; reload the checklist.`,
        { currentRevision: latest!.number },
      );
    }
    const existing = await BenchRecord.findOne({
      where: { revisionId: revision.id, itemKey: key },
      transaction: t,
    });
    const snapshot = snapshotOf(revision);
    const target = targetOf(snapshot, key, existing);
    if (!target) throw notFound(`"${key}" in revision ${number}`);
    const offered = new Set(target.ticks.map((d) => d.key));
    const issues = Object.keys(input.ticks)
      .filter((k) => !offered.has(k as never))
      .map((k) => ({ field: `ticks.${k}`, message: `is not offered for ${target.name}` }));
    if (input.reading !== null && !target.takesReading) {
      issues.push({ field: 'reading', message: `${target.name} takes no reading` });
    }
    if (input.ticks.passed && input.ticks.failed) {
      issues.push({ field: 'ticks.failed', message: 'a check either passes or fails' });
    }
    if (issues.length) {
      throw unprocessable(
        'not_offered',
        `That does not apply to ${target.name}: ${issues.map((i) => `${i.field} ${i.message}`).join('; ')}.`,
        issues,
      );
    }
    if ((existing?.version ?? null) !== input.version) {
      throw versionConflict(existing ? toRecordDto(existing) : null);
    }
    const ticks = Object.fromEntries(target.ticks.map((d) => [d.key, input.ticks[d.key] === true]));
    const fields = {
      ticksJson: JSON.stringify(ticks),
      reading: input.reading,
      note: input.note,
      recordedById: actor.id,
      recordedByName: actor.name,
    };
    const before = existing ? toRecordDto(existing) : null;
    const record =
      existing ?? BenchRecord.build({ revisionId: revision.id, itemKey: key, ...fields });
    record.set(fields);
    await record.save({ transaction: t });
    const said = [
      ...target.ticks.filter((d) => ticks[d.key]).map((d) => d.label.toLowerCase()),
      input.reading != null ? `reading ${input.reading}` : '',
    ].filter(Boolean);
    await recordAudit(t, actor, {
      conversionId,
      action: 'bench_record',
      entityType: 'bench_item',
      entityId: record.id,
      summary: `Bench, revision ${number}, ${target.name}: ${said.join(', ') || 'cleared'}`,
      before,
      after: { ticks, reading: input.reading, note: input.note },
    });
    return toRecordDto(record);
  });
}

/** The generated test plan of a signed-off revision with what has been recorded against it. */
export async function getTestPlan(
  actor: Actor,
  conversionId: number,
  number: number,
): Promise<TestPlanResponse> {
  const { revision, current } = (await signedOffRevision(actor, conversionId, number))!;
  const plan = buildTestPlan(snapshotOf(revision));
  const { records } = await recordsOf(revision.id);
  const battery = records.get('test:battery')?.reading ?? null;
  const results: Record<string, TestResult> = {};
  for (const step of plan.steps) {
    const r = records.get(step.key);
    if (!r) continue;
    results[step.key] = {
      ticks: r.ticks,
      reading: r.reading,
      passed: r.ticks.passed === true,
      failed: r.ticks.failed === true,
      note: r.note,
      verdict: judgeStep(
        step,
        { reading: r.reading, passed: r.ticks.passed, failed: r.ticks.failed },
        battery,
      ),
      recordedBy: r.recordedBy,
      recordedAt: r.recordedAt,
      version: r.version,
    };
  }
  return { revision: { number: revision.number, hash: revision.hash, current }, plan, results };
}

/** For the conversions list: the revision each conversion's bench works from, and rework open. */
export async function benchNotices(actor: Actor): Promise<Map<number, BenchNotice>> {
  const conversions = await Conversion.findAll({
    where: { workshopId: actor.workshopId },
    attributes: ['id'],
  });
  const signed = await Revision.findAll({
    where: { conversionId: { [Op.in]: conversions.map((c) => c.id) }, status: 'signed_off' },
    attributes: ['id', 'conversionId', 'number', 'signedAt', 'snapshotJson'],
    order: [['number', 'DESC']],
  });
  const latest = new Map<number, Revision>();
  for (const r of signed) if (!latest.has(r.conversionId)) latest.set(r.conversionId, r);
  const records = await BenchRecord.findAll({
    where: { revisionId: [...latest.values()].map((r) => r.id) },
  });
  const owed = records.filter((r) => r.reworkJson != null);
  const notices = new Map<number, BenchNotice>();
  for (const revision of latest.values()) {
    const plan = benchPlanItems(snapshotOf(revision));
    const items = new Map(plan.map((i) => [i.key, i]));
    const ticks = new Map(
      records.filter((r) => r.revisionId === revision.id).map((r) => [r.itemKey, ticksOf(r)]),
    );
    const open = owed.filter((r) => {
      if (r.revisionId !== revision.id) return false;
      const item = items.get(r.itemKey);
      return item ? !isDone(item, ticksOf(r)) : !ticksOf(r).done;
    }).length;
    notices.set(revision.conversionId, {
      revisionNumber: revision.number,
      signedAt: iso(revision.signedAt!),
      reworkOpen: open,
      progress: {
        total: plan.length,
        done: plan.filter((i) => isDone(i, ticks.get(i.key))).length,
        tested: plan.filter((i) => isTested(i, ticks.get(i.key))).length,
      },
    });
  }
  return notices;
}

/** Stores a photo of a bench item through the file store, then records it. PNG or JPEG only. */
export async function addBenchPhoto(
  actor: Actor,
  conversionId: number,
  number: number,
  key: string,
  file: UploadedFile,
): Promise<BenchPhotoDto> {
  const contentType = sniffType(file.buffer);
  if (contentType !== 'image/png' && contentType !== 'image/jpeg') {
    throw new AppError(
      415,
      'unsupported_media_type',
      'A bench photo must be a PNG or JPEG image. Nothing was saved.',
    );
  }
  const found = await signedOffRevision(actor, conversionId, number);
  if (!found!.current) {
    throw new AppError(
      409,
      'superseded',
      `A later revision was signed off after revision ${number}: photos go on the revision the bench works from.`,
    );
  }
  const target = targetOf(snapshotOf(found!.revision), key, null);
  if (!target) throw notFound(`"${key}" in revision ${number}`);
  const storageKey = randomUUID();
  const sha256 = createHash('sha256').update(file.buffer).digest('hex');
  const store = fileStore();
  await store.put(storageKey, file.buffer, contentType);
  try {
    const photo = await inTransaction(db(), async (t) => {
      const row = await BenchPhoto.create(
        {
          workshopId: actor.workshopId,
          revisionId: found!.revision.id,
          itemKey: key,
          storageKey,
          fileName: displayFileName(file.originalName),
          contentType,
          sizeBytes: file.buffer.length,
          sha256,
          takenById: actor.id,
          takenByName: actor.name,
        },
        { transaction: t },
      );
      await recordAudit(t, actor, {
        conversionId,
        action: 'create',
        entityType: 'bench_photo',
        entityId: row.id,
        summary: `Photo of ${target.name} at the bench, revision ${number}`,
        after: { fileName: row.fileName, contentType, sizeBytes: row.sizeBytes, sha256 },
      });
      return row;
    });
    return toPhotoDto(photo);
  } catch (err) {
    await store.delete(storageKey).catch((e: unknown) => {
      logger.error({ err: e, storageKey }, 'could not remove an unrecorded bench photo');
    });
    throw err;
  }
}

/** A bench photo and its bytes, for a signed-in user of the same workshop (anyone else: 404). */
export async function readBenchPhoto(actor: Actor, id: number) {
  const photo = await BenchPhoto.findOne({ where: { id, workshopId: actor.workshopId } });
  if (!photo) throw notFound('That photo');
  const bytes = await readVerified(photo.storageKey, photo.sha256, { entity: 'bench_photo', id });
  if (!bytes) throw notFound('The stored file of that photo');
  return { photo, bytes };
}
