import type { Transaction } from 'sequelize';
import type { CheckReport, Finding } from '#shared/schemas/checks.schema.ts';
import type { ConversionSnapshot } from '#shared/schemas/snapshot.schema.ts';
import { reportOf, storedFindings } from '#shared/domain/checks/run-checks.ts';
import { Workshop } from '../../db/models/index.ts';
import type { Actor } from '../../lib/actor.ts';
import { dropAllowancesOf } from '../workshop/workshop.service.ts';
import { loadConversionSnapshot } from './snapshot.service.ts';

/**
 * The conversion's current plan and every check run over it: the report shown in the workshop's
 * unit, and the findings as a revision stores them (sizes as numbers).
 * Pass the transaction when the report must match what the same transaction writes.
 */
export async function checkConversion(
  actor: Pick<Actor, 'workshopId'>,
  conversionId: number,
  transaction?: Transaction,
): Promise<{ snapshot: ConversionSnapshot; report: CheckReport; stored: Finding[] }> {
  const snapshot = await loadConversionSnapshot(actor, conversionId, transaction);
  const workshop = await Workshop.findByPk(actor.workshopId, { transaction });
  const sizeUnit = workshop?.sizeUnit ?? 'mm2';
  const dropAllowances = workshop ? dropAllowancesOf(workshop) : undefined;
  const stored = storedFindings(snapshot, { sizeUnit, dropAllowances });
  return { snapshot, report: reportOf(stored, sizeUnit), stored };
}

export async function runConversionChecks(
  actor: Actor,
  conversionId: number,
): Promise<CheckReport> {
  return (await checkConversion(actor, conversionId)).report;
}
