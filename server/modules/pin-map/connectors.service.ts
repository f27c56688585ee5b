import { QueryTypes, type Transaction } from 'sequelize';
import type { Disposition } from '#shared/domain/dispositions.ts';
import {
  defaultFaceLayout,
  pinHoldsData,
  type Connector as ConnectorDto,
  type CreateConnectorRequest,
  type UpdateConnectorRequest,
} from '#shared/schemas/pin-map.schema.ts';
import { labelKey } from '#shared/domain/labels.ts';
import { db } from '../../db/index.ts';
import { Connector, Feed, FeedLoad, Pin } from '../../db/models/index.ts';
import type { Actor } from '../../lib/actor.ts';
import { AppError, badRequest, notFound, versionConflict } from '../../lib/errors.ts';
import { inTransaction, inTransactionOf } from '../../lib/transaction.ts';
import { recordAudit } from '../audit/audit.service.ts';
import {
  findConversionInWorkshop,
  ofConversionInWorkshop,
} from '../conversions/conversions.service.ts';
import { toConnectorDto } from './pin-dto.ts';
import { readTogether } from '../../db/portable.ts';

export interface ConnectorWithCounts extends ConnectorDto {
  counts: Partial<Record<Disposition, number>>;
}

export async function listConnectors(
  actor: Actor,
  conversionId: number,
): Promise<ConnectorWithCounts[]> {
  await findConversionInWorkshop(actor, conversionId);
  const connectors = await Connector.findAll({ where: { conversionId }, order: [['id', 'ASC']] });
  const counts = await db().query<{ connectorId: number; disposition: Disposition; n: number }>(
    `SELECT connector_id AS "connectorId", disposition, COUNT(*) AS n FROM pins
     WHERE conversion_id = :conversionId GROUP BY connector_id, disposition`,
    { replacements: { conversionId }, type: QueryTypes.SELECT },
  );
  return connectors.map((c) => ({
    ...toConnectorDto(c),
    counts: Object.fromEntries(
      counts.filter((r) => r.connectorId === c.id).map((r) => [r.disposition, r.n]),
    ),
  }));
}

/** The connector with this id in the actor's workshop, or 404 (another workshop's ids look missing). */
export async function findConnectorInWorkshop(
  actor: Pick<Actor, 'workshopId'>,
  id: number,
  transaction?: Transaction,
): Promise<Connector> {
  const connector = await Connector.findOne({
    where: { id },
    include: [ofConversionInWorkshop(actor)],
    transaction,
  });
  if (!connector) throw notFound('That connector');
  return connector;
}

async function assertLabelFree(
  conversionId: number,
  label: string,
  exceptId: number | null,
  t: Transaction,
) {
  // Compared by look-alike key, so "Е1" (Cyrillic Е) cannot stand beside "E1".
  const key = labelKey(label);
  const others = await Connector.findAll({
    where: { conversionId },
    attributes: ['id', 'label'],
    transaction: t,
  });
  const clash = others.find((c) => c.id !== exceptId && labelKey(c.label) === key);
  if (clash) {
    throw new AppError(
      409,
      'duplicate',
      clash.label === label
        ? `This conversion already has a connector labelled "${label}".`
        : `"${label}" looks the same as connector "${clash.label}" in this conversion; choose a label that reads differently.`,
      [{ field: 'label', message: 'is already used in this conversion' }],
    );
  }
}

function assertLayoutHolds(rows: number, columns: number, cavityCount: number) {
  if (rows * columns < cavityCount) {
    throw badRequest(`rows: ${rows} × ${columns} cannot hold ${cavityCount} cavities`, [
      { field: 'rows', message: `${rows} × ${columns} cannot hold ${cavityCount} cavities` },
    ]);
  }
}

/** Which of these pins another pin, a feed's relay coil or a feed's load points at. */
async function pinsReferenced(pinIds: number[], t: Transaction): Promise<Set<number>> {
  const [linked, coils, loads] = await readTogether(
    t,
    () =>
      Pin.findAll({
        where: { destinationPinId: pinIds },
        attributes: ['destinationPinId'],
        transaction: t,
      }),
    () =>
      Feed.findAll({
        where: { relayCoilPinId: pinIds },
        attributes: ['relayCoilPinId'],
        transaction: t,
      }),
    () => FeedLoad.findAll({ where: { pinId: pinIds }, attributes: ['pinId'], transaction: t }),
  );
  return new Set([
    ...linked.map((p) => p.destinationPinId!),
    ...coils.map((f) => f.relayCoilPinId!),
    ...loads.map((l) => l.pinId!),
  ]);
}

/** Cavity labels for new cavities: the next numbers after the highest numeric label. */
function nextCavityLabels(existing: string[], count: number): string[] {
  const taken = new Set(existing);
  const labels: string[] = [];
  for (let n = 1; labels.length < count; n++) {
    if (!taken.has(String(n))) labels.push(String(n));
  }
  return labels;
}

/** A connector and its N cavities, all undecided, in one transaction. */
export async function createConnector(
  actor: Actor,
  conversionId: number,
  input: CreateConnectorRequest,
  transaction?: Transaction,
): Promise<ConnectorDto> {
  const work = async (t: Transaction) => {
    await findConversionInWorkshop(actor, conversionId, t);
    await assertLabelFree(conversionId, input.label, null, t);
    const layout = defaultFaceLayout(input.cavityCount);
    const rows =
      input.rows ?? (input.columns ? Math.ceil(input.cavityCount / input.columns) : layout.rows);
    const columns = input.columns ?? Math.ceil(input.cavityCount / rows);
    assertLayoutHolds(rows, columns, input.cavityCount);
    const connector = await Connector.create(
      {
        conversionId,
        label: input.label,
        side: input.side,
        cavityCount: input.cavityCount,
        rows,
        columns,
        notes: input.notes ?? '',
      },
      { transaction: t },
    );
    const labels = input.cavityLabels ?? nextCavityLabels([], input.cavityCount);
    await Pin.bulkCreate(
      labels.map((cavity, position) => ({
        conversionId,
        connectorId: connector.id,
        cavity,
        position,
      })),
      { transaction: t },
    );
    await recordAudit(t, actor, {
      conversionId,
      action: 'create',
      entityType: 'connector',
      entityId: connector.id,
      summary: `Added connector ${connector.label} (${connector.side}, ${connector.cavityCount} cavities)`,
      after: toConnectorDto(connector),
    });
    return toConnectorDto(connector);
  };
  return inTransactionOf(db(), transaction, work);
}

export async function updateConnector(
  actor: Actor,
  connectorId: number,
  input: UpdateConnectorRequest,
): Promise<ConnectorDto> {
  return inTransaction(db(), async (t) => {
    const connector = await findConnectorInWorkshop(actor, connectorId, t);
    if (connector.version !== input.version) throw versionConflict(toConnectorDto(connector));
    const before = toConnectorDto(connector);
    if (input.label && input.label !== connector.label) {
      await assertLabelFree(connector.conversionId, input.label, connector.id, t);
    }
    const cavityCount = input.cavityCount ?? connector.cavityCount;
    let rows = input.rows ?? connector.rows;
    let columns = input.columns ?? connector.columns;
    // A connector that grows past its face keeps its row count (or takes the usual layout).
    if (rows * columns < cavityCount && input.columns === undefined) {
      if (input.rows === undefined) rows = Math.max(rows, defaultFaceLayout(cavityCount).rows);
      columns = Math.ceil(cavityCount / rows);
    }
    assertLayoutHolds(rows, columns, cavityCount);

    if (cavityCount !== connector.cavityCount) {
      const pins = await Pin.findAll({
        where: { connectorId },
        order: [['position', 'ASC']],
        transaction: t,
      });
      if (cavityCount > pins.length) {
        const labels = nextCavityLabels(
          pins.map((p) => p.cavity),
          cavityCount - pins.length,
        );
        await Pin.bulkCreate(
          labels.map((cavity, i) => ({
            conversionId: connector.conversionId,
            connectorId,
            cavity,
            position: pins.length + i,
          })),
          { transaction: t },
        );
      } else {
        const dropped = pins.slice(cavityCount);
        const referenced = await pinsReferenced(
          dropped.map((p) => p.id),
          t,
        );
        const worked = dropped.filter((p) => pinHoldsData(p) || referenced.has(p.id));
        if (worked.length) {
          throw new AppError(
            409,
            'cavities_in_use',
            `Cavities ${worked.map((p) => p.cavity).join(', ')} hold data or are linked from other pins or feeds; clear them before removing them.`,
          );
        }
        await Pin.destroy({ where: { id: dropped.map((p) => p.id) }, transaction: t });
      }
    }
    const { version: _version, ...fields } = input;
    connector.set({ ...fields, rows, columns, cavityCount });
    await connector.save({ transaction: t });
    await recordAudit(t, actor, {
      conversionId: connector.conversionId,
      action: 'update',
      entityType: 'connector',
      entityId: connector.id,
      summary: `Changed connector ${connector.label}`,
      before,
      after: toConnectorDto(connector),
    });
    return toConnectorDto(connector);
  });
}

export async function deleteConnector(actor: Actor, connectorId: number): Promise<void> {
  await inTransaction(db(), async (t) => {
    const connector = await findConnectorInWorkshop(actor, connectorId, t);
    const pinCount = await Pin.count({ where: { connectorId }, transaction: t });
    await connector.destroy({ transaction: t });
    await recordAudit(t, actor, {
      conversionId: connector.conversionId,
      action: 'delete',
      entityType: 'connector',
      entityId: connector.id,
      summary: `Removed connector ${connector.label} and its ${pinCount} pins`,
      before: toConnectorDto(connector),
    });
  });
}
