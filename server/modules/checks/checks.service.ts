import type { CheckReport } from '#shared/schemas/checks.schema.ts';
import { checkReport } from '#shared/domain/checks/run-checks.ts';
import { Workshop } from '../../db/models/index.ts';
import type { Actor } from '../../lib/actor.ts';
import { loadConversionSnapshot } from './snapshot.service.ts';

/** Runs every check over the conversion's current plan; sizes read in the workshop's unit. */
export async function runConversionChecks(
  actor: Actor,
  conversionId: number,
): Promise<CheckReport> {
  const snapshot = await loadConversionSnapshot(actor, conversionId);
  const workshop = await Workshop.findByPk(actor.workshopId);
  return checkReport(snapshot, { sizeUnit: workshop?.sizeUnit ?? 'mm2' });
}
