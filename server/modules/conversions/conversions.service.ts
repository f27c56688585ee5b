import type {
  Conversion as ConversionDto,
  CreateConversionRequest,
  UpdateConversionRequest,
} from '#shared/schemas/conversions.schema.ts';
import { db } from '../../db/index.ts';
import { readRows } from '../../db/fast-read.ts';
import { Conversion, User } from '../../db/models/index.ts';
import type { Actor } from '../../lib/actor.ts';
import { notFound, versionConflict } from '../../lib/errors.ts';
import { inTransaction } from '../../lib/transaction.ts';
import type { Transaction } from 'sequelize';
import { beforeAndAfter, changedFields, recordAudit } from '../audit/audit.service.ts';

const withCreator = [{ model: User, as: 'createdBy', attributes: ['id', 'name'] }];

export function toConversionDto(conversion: Conversion): ConversionDto {
  return {
    id: conversion.id,
    name: conversion.name,
    donorEngine: conversion.donorEngine,
    receivingVehicle: conversion.receivingVehicle,
    systemVoltage: conversion.systemVoltage,
    notes: conversion.notes,
    createdBy: conversion.createdBy
      ? { id: conversion.createdBy.id, name: conversion.createdBy.name }
      : null,
    version: conversion.version,
    createdAt: conversion.createdAt.toISOString(),
    updatedAt: conversion.updatedAt.toISOString(),
  };
}

/**
 * An include that keeps a conversion's child rows (pins, connectors…) to the actor's workshop:
 * another workshop's rows are simply not found.
 */
export function ofConversionInWorkshop(actor: Pick<Actor, 'workshopId'>) {
  return {
    model: Conversion,
    attributes: [],
    where: { workshopId: actor.workshopId },
    required: true,
  };
}

/**
 * The conversion with this id in the actor's workshop, or 404: another workshop's ids look
 * exactly like ids that do not exist.
 */
export async function findConversionInWorkshop(
  actor: Pick<Actor, 'workshopId'>,
  id: number,
  transaction?: Transaction,
): Promise<Conversion> {
  const conversion = await Conversion.findOne({
    where: { id, workshopId: actor.workshopId },
    include: withCreator,
    transaction,
  });
  if (!conversion) throw notFound('That conversion');
  return conversion;
}

/**
 * The change counter of the conversion with this id in the actor's workshop (migration 0009), or
 * 404. One small row, no model: this is the first read of every cached list.
 */
export async function conversionChangeCounter(
  actor: Pick<Actor, 'workshopId'>,
  id: number,
): Promise<number> {
  const [row] = await readRows<{ counter: number }>(
    `SELECT COALESCE(cc.counter, 0) AS counter FROM conversions c
       LEFT JOIN conversion_changes cc ON cc.conversion_id = c.id
      WHERE c.id = ? AND c.workshop_id = ?`,
    [id, actor.workshopId],
  );
  if (!row) throw notFound('That conversion');
  return row.counter;
}

export async function listConversions(actor: Actor): Promise<ConversionDto[]> {
  const conversions = await Conversion.findAll({
    where: { workshopId: actor.workshopId },
    include: withCreator,
    order: [['updatedAt', 'DESC']],
  });
  return conversions.map(toConversionDto);
}

export async function getConversion(actor: Actor, id: number): Promise<ConversionDto> {
  return toConversionDto(await findConversionInWorkshop(actor, id));
}

export async function createConversion(
  actor: Actor,
  input: CreateConversionRequest,
): Promise<ConversionDto> {
  return inTransaction(db(), async (t) => {
    const created = await Conversion.create(
      {
        workshopId: actor.workshopId,
        name: input.name,
        donorEngine: input.donorEngine,
        receivingVehicle: input.receivingVehicle,
        systemVoltage: input.systemVoltage,
        notes: input.notes ?? '',
        createdById: actor.id,
      },
      { transaction: t },
    );
    await recordAudit(t, actor, {
      conversionId: created.id,
      action: 'create',
      entityType: 'conversion',
      entityId: created.id,
      summary: `Created conversion "${created.name}"`,
      after: input,
    });
    return toConversionDto(await findConversionInWorkshop(actor, created.id, t));
  });
}

export async function updateConversion(
  actor: Actor,
  id: number,
  input: UpdateConversionRequest,
): Promise<ConversionDto> {
  return inTransaction(db(), async (t) => {
    const conversion = await findConversionInWorkshop(actor, id, t);
    if (conversion.version !== input.version) throw versionConflict(toConversionDto(conversion));
    const { version: _version, ...fields } = input;
    const before = toConversionDto(conversion);
    const changes = changedFields(before, fields);
    conversion.set(fields);
    await conversion.save({ transaction: t });
    await recordAudit(t, actor, {
      conversionId: id,
      action: 'update',
      entityType: 'conversion',
      entityId: id,
      summary: `Changed conversion details: ${Object.keys(changes).join(', ') || 'nothing'}`,
      ...beforeAndAfter(changes),
    });
    return toConversionDto(conversion);
  });
}
