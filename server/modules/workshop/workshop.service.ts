import type { DropAllowances } from '#shared/domain/electrical/drop-budget.ts';
import type { UpdateWorkshopRequest, WorkshopSettings } from '#shared/schemas/workshop.schema.ts';
import { db } from '../../db/index.ts';
import { Workshop } from '../../db/models/index.ts';
import type { Actor } from '../../lib/actor.ts';
import { notFound, versionConflict } from '../../lib/errors.ts';
import { inTransaction } from '../../lib/transaction.ts';
import { changedFields, recordAudit } from '../audit/audit.service.ts';

/** The workshop's drop allowances, as the checks take them. */
export function dropAllowancesOf(workshop: Workshop): DropAllowances {
  return {
    fuseV: workshop.dropFuseV,
    relayContactsV: workshop.dropRelayContactsV,
    perConnectionV: workshop.dropPerConnectionV,
    chassisReturnV: workshop.dropChassisReturnV,
  };
}

export function toWorkshopSettings(workshop: Workshop): WorkshopSettings {
  return {
    id: workshop.id,
    name: workshop.name,
    paperSize: workshop.paperSize,
    sizeUnit: workshop.sizeUnit,
    systemVoltage: workshop.systemVoltage,
    defaultInsulationC: workshop.defaultInsulationC,
    serviceAllowancePct: workshop.serviceAllowancePct,
    dropAllowances: dropAllowancesOf(workshop),
    version: workshop.version,
  };
}

export async function getWorkshopSettings(
  actor: Pick<Actor, 'workshopId'>,
): Promise<WorkshopSettings> {
  const workshop = await Workshop.findByPk(actor.workshopId);
  if (!workshop) throw notFound('Your workshop');
  return toWorkshopSettings(workshop);
}

export async function updateWorkshopSettings(
  actor: Actor,
  input: UpdateWorkshopRequest,
): Promise<WorkshopSettings> {
  return inTransaction(db(), async (t) => {
    const workshop = await Workshop.findByPk(actor.workshopId, { transaction: t });
    if (!workshop) throw notFound('Your workshop');
    if (workshop.version !== input.version) throw versionConflict(toWorkshopSettings(workshop));
    const { version: _version, dropAllowances, ...fields } = input;
    const before = toWorkshopSettings(workshop);
    const changes = changedFields(before, { ...fields, ...(dropAllowances && { dropAllowances }) });
    workshop.set(fields);
    if (dropAllowances) {
      workshop.set({
        dropFuseV: dropAllowances.fuseV,
        dropRelayContactsV: dropAllowances.relayContactsV,
        dropPerConnectionV: dropAllowances.perConnectionV,
        dropChassisReturnV: dropAllowances.chassisReturnV,
      });
    }
    await workshop.save({ transaction: t });
    await recordAudit(t, actor, {
      action: 'update',
      entityType: 'workshop',
      entityId: workshop.id,
      summary: `Changed workshop settings: ${Object.keys(changes).join(', ') || 'nothing'}`,
      before,
      after: toWorkshopSettings(workshop),
    });
    return toWorkshopSettings(workshop);
  });
}
