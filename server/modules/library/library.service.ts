import { Op, UniqueConstraintError, type Transaction } from 'sequelize';
import type {
  ConnectorFromTemplateRequest,
  PinoutTemplate as TemplateDto,
  PinoutTemplateDetail,
  SaveTemplateRequest,
  TemplatePin,
} from '#shared/schemas/library.schema.ts';
import type { Connector as ConnectorDto, PinFields } from '#shared/schemas/pin-map.schema.ts';
import { TEMPLATE_PIN_FIELDS, type TemplatePinKey } from '#shared/domain/fields/pin-fields.ts';
import { db } from '../../db/index.ts';
import { Pin, PinoutTemplate, PinoutTemplatePin, User } from '../../db/models/index.ts';
import type { Actor } from '../../lib/actor.ts';
import { AppError, notFound } from '../../lib/errors.ts';
import { inTransaction } from '../../lib/transaction.ts';
import { recordAudit } from '../audit/audit.service.ts';
import { createConnector, findConnectorInWorkshop } from '../pin-map/connectors.service.ts';

function toTemplateDto(t: PinoutTemplate): TemplateDto {
  return {
    id: t.id,
    name: t.name,
    side: t.side,
    description: t.description,
    cavityCount: t.cavityCount,
    rows: t.rows,
    columns: t.columns,
    builtIn: t.builtIn,
    createdBy: t.createdBy?.name ?? null,
    createdAt: t.createdAt.toISOString(),
  };
}

/** The pin fields a template keeps, taken from a pin or a template's pin. */
function templateFields(p: Pick<PinFields, TemplatePinKey>): Pick<PinFields, TemplatePinKey> {
  return Object.fromEntries(TEMPLATE_PIN_FIELDS.map((k) => [k, p[k]])) as Pick<
    PinFields,
    TemplatePinKey
  >;
}

function toTemplatePin(p: PinoutTemplatePin): TemplatePin {
  return { cavity: p.cavity, position: p.position, ...templateFields(p) };
}

/** Templates a workshop can see: its own and the built-in ones. */
const visibleTo = (actor: Pick<Actor, 'workshopId'>) => ({
  [Op.or]: [{ workshopId: actor.workshopId }, { builtIn: true }],
});

export async function listTemplates(actor: Actor): Promise<TemplateDto[]> {
  const templates = await PinoutTemplate.findAll({
    where: visibleTo(actor),
    include: [{ model: User, as: 'createdBy', attributes: ['name'] }],
    order: [
      ['builtIn', 'DESC'],
      ['name', 'ASC'],
    ],
  });
  return templates.map(toTemplateDto);
}

async function findTemplate(
  actor: Actor,
  id: number,
  transaction?: Transaction,
): Promise<PinoutTemplate> {
  const template = await PinoutTemplate.findOne({
    where: { id, ...visibleTo(actor) },
    include: [
      { model: User, as: 'createdBy', attributes: ['name'] },
      { model: PinoutTemplatePin, as: 'pins' },
    ],
    order: [[{ model: PinoutTemplatePin, as: 'pins' }, 'position', 'ASC']],
    transaction,
  });
  if (!template) throw notFound('That template');
  return template;
}

export async function getTemplate(actor: Actor, id: number): Promise<PinoutTemplateDetail> {
  const template = await findTemplate(actor, id);
  return { ...toTemplateDto(template), pins: (template.pins ?? []).map(toTemplatePin) };
}

/** Saves a connector's cavities, face layout and each pin's wire and decision as a workshop template. */
export async function saveTemplate(
  actor: Actor,
  input: SaveTemplateRequest,
): Promise<PinoutTemplateDetail> {
  const id = await inTransaction(db(), async (t) => {
    const connector = await findConnectorInWorkshop(actor, input.connectorId, t);
    const pins = await Pin.findAll({
      where: { connectorId: connector.id },
      order: [['position', 'ASC']],
      transaction: t,
    });
    let template: PinoutTemplate;
    try {
      template = await PinoutTemplate.create(
        {
          workshopId: actor.workshopId,
          builtIn: false,
          name: input.name,
          side: connector.side,
          description: input.description ?? '',
          cavityCount: pins.length,
          rows: connector.rows,
          columns: connector.columns,
          createdById: actor.id,
        },
        { transaction: t },
      );
    } catch (err) {
      if (err instanceof UniqueConstraintError) {
        throw new AppError(
          409,
          'duplicate',
          `The library already has a template named "${input.name}".`,
          [{ field: 'name', message: 'is already used in the library' }],
        );
      }
      throw err;
    }
    await PinoutTemplatePin.bulkCreate(
      pins.map((p, position) => ({
        templateId: template.id,
        cavity: p.cavity,
        position,
        ...templateFields(p),
      })),
      { transaction: t },
    );
    await recordAudit(t, actor, {
      conversionId: connector.conversionId,
      action: 'create',
      entityType: 'pinout_template',
      entityId: template.id,
      summary: `Saved connector ${connector.label} as library template "${template.name}" (${pins.length} cavities)`,
    });
    return template.id;
  });
  return getTemplate(actor, id);
}

export async function deleteTemplate(actor: Actor, id: number): Promise<void> {
  await inTransaction(db(), async (t) => {
    const template = await findTemplate(actor, id, t);
    if (template.builtIn) {
      throw new AppError(
        409,
        'read_only',
        'Built-in templates come with Loomwright and cannot be deleted.',
      );
    }
    await template.destroy({ transaction: t });
    await recordAudit(t, actor, {
      action: 'delete',
      entityType: 'pinout_template',
      entityId: template.id,
      summary: `Deleted library template "${template.name}"`,
      before: toTemplateDto(template),
    });
  });
}

/**
 * A new connector of the conversion with the template's cavities, layout and pin details, in one
 * transaction. Destinations are not part of a template: they belong to one conversion.
 */
export async function connectorFromTemplate(
  actor: Actor,
  conversionId: number,
  input: ConnectorFromTemplateRequest,
): Promise<ConnectorDto> {
  return inTransaction(db(), async (t) => {
    const template = await findTemplate(actor, input.templateId, t);
    const pins = template.pins ?? [];
    const connector = await createConnector(
      actor,
      conversionId,
      {
        label: input.label,
        side: input.side ?? template.side,
        cavityCount: pins.length,
        rows: template.rows,
        columns: template.columns,
        cavityLabels: pins.map((p) => p.cavity),
        notes: `Started from the library template "${template.name}".`,
      },
      t,
    );
    const created = await Pin.findAll({ where: { connectorId: connector.id }, transaction: t });
    const byCavity = new Map(pins.map((p) => [p.cavity, p]));
    await Pin.bulkCreate(
      created.map((pin) => {
        const from = byCavity.get(pin.cavity)!;
        return { ...pin.get({ plain: true }), ...templateFields(from) };
      }),
      {
        updateOnDuplicate: TEMPLATE_PIN_FIELDS,
        transaction: t,
      },
    );
    await recordAudit(t, actor, {
      conversionId,
      action: 'create',
      entityType: 'connector',
      entityId: connector.id,
      summary: `Filled connector ${connector.label} from library template "${template.name}"`,
    });
    return connector;
  });
}
