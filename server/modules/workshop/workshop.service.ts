import type { UpdateWorkshopRequest, WorkshopSettings } from '#shared/schemas/workshop.schema.ts';
import { db } from '../../db/index.ts';
import { Workshop } from '../../db/models/index.ts';
import type { Actor } from '../../lib/actor.ts';
import { notFound, versionConflict } from '../../lib/errors.ts';
import { inTransaction } from '../../lib/transaction.ts';
import { changedFields, recordAudit } from '../audit/audit.service.ts';

export function toWorkshopSettings(workshop: Workshop): WorkshopSettings {
  return {
    id: workshop.id,
    name: workshop.name,
    paperSize: workshop.paperSize,
    sizeUnit: workshop.sizeUnit,
    systemVoltage: workshop.systemVoltage,
    defaultInsulationC: workshop.defaultInsulationC,
    serviceAllowancePct: workshop.serviceAllowancePct,
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
    const { version: _version, ...fields } = input;
    const before = toWorkshopSettings(workshop);
    const changes = changedFields(before, fields);
    workshop.set(fields);
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
