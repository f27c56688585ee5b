import type { Transaction } from 'sequelize';
import type { ConversionSnapshot } from '#shared/schemas/snapshot.schema.ts';
import { withoutVersions } from '#shared/schemas/harness.schema.ts';
import { Connector, Feed, FeedLoad, Pin, Workshop } from '../../db/models/index.ts';
import type { Actor } from '../../lib/actor.ts';
import { findConversionInWorkshop } from '../conversions/conversions.service.ts';
import { toFeedDto } from '../feeds/feeds.service.ts';
import { harnessOf } from '../harness/harness.repository.ts';
import { toConnectorDto, toPinDto } from '../pin-map/pin-dto.ts';
import { PIN_ORDER } from '../pin-map/pins.service.ts';
import { readTogether } from '../../db/portable.ts';

/**
 * The conversion's plan as it stands, in the snapshot form the checks read and revisions freeze.
 * Pass the transaction when the snapshot must match what the same transaction writes.
 */
export async function loadConversionSnapshot(
  actor: Pick<Actor, 'workshopId'>,
  conversionId: number,
  transaction?: Transaction,
): Promise<ConversionSnapshot> {
  const conversion = await findConversionInWorkshop(actor, conversionId, transaction);
  const [workshop, connectors, pins, feeds, harness] = await readTogether(
    transaction,
    () => Workshop.findByPk(actor.workshopId, { transaction }),
    () => Connector.findAll({ where: { conversionId }, order: [['id', 'ASC']], transaction }),
    () => Pin.findAll({ where: { conversionId }, order: PIN_ORDER, raw: true, transaction }),
    () =>
      Feed.findAll({
        where: { conversionId },
        include: [{ model: FeedLoad, as: 'loads' }],
        order: [['id', 'ASC']],
        transaction,
      }),
    () => harnessOf(conversionId, transaction),
  );
  return {
    format: 1,
    conversion: {
      id: conversion.id,
      name: conversion.name,
      donorEngine: conversion.donorEngine,
      receivingVehicle: conversion.receivingVehicle,
      systemVoltage: conversion.systemVoltage,
      notes: conversion.notes,
    },
    workshop: { id: workshop!.id, name: workshop!.name },
    connectors: connectors.map((c) => {
      const { version: _v, ...rest } = toConnectorDto(c);
      return rest;
    }),
    pins: pins.map((p) => {
      const { version: _v, updatedAt: _u, ...rest } = toPinDto(p);
      return rest;
    }),
    feeds: feeds.map((f) => {
      const { version: _v, ...rest } = toFeedDto(f);
      return rest;
    }),
    harness: withoutVersions(harness),
  };
}
