import type { Transaction } from 'sequelize';
import type { CheckReport } from '#shared/schemas/checks.schema.ts';
import type { ConversionSnapshot } from '#shared/schemas/snapshot.schema.ts';
import { checkReport } from '#shared/domain/checks/run-checks.ts';
import { Workshop } from '../../db/models/index.ts';
import type { Actor } from '../../lib/actor.ts';
import { loadConversionSnapshot } from './snapshot.service.ts';

/**
 * The conversion's current plan and every check run over it; sizes read in the workshop's unit.
 * Pass the transaction when the report must match what the same transaction writes.
 */
export async function checkConversion(
  actor: Pick<Actor, 'workshopId'>,
  conversionId: number,
  transaction?: Transaction,
): Promise<{ snapshot: ConversionSnapshot; report: CheckReport }> {
  const snapshot = await loadConversionSnapshot(actor, conversionId, transaction);
  const workshop = await Workshop.findByPk(actor.workshopId, { transaction });
  return { snapshot, report: checkReport(snapshot, { sizeUnit: workshop?.sizeUnit ?? 'mm2' }) };
}

export async function runConversionChecks(
  actor: Actor,
  conversionId: number,
): Promise<CheckReport> {
  return (await checkConversion(actor, conversionId)).report;
}
