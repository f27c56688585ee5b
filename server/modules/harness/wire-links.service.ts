/**
 * One fact for a pin and its wire: when a pin's destination moves to another cavity, the wire that
 * ran straight to the old one follows it, so the pin map, the wire list and the checks agree.
 */
import { QueryTypes, type Transaction } from 'sequelize';
import { cavityName } from '#shared/domain/pin-names.ts';
import { db } from '../../db/index.ts';
import type { Pin } from '../../db/models/index.ts';
import { insertReturningId } from '../../db/portable.ts';
import type { Actor } from '../../lib/actor.ts';
import { recordAudit } from '../audit/audit.service.ts';
import { nextLabel, writeEnds } from './harness.service.ts';

const select = <T extends object>(
  sql: string,
  replacements: Record<string, unknown>,
  transaction: Transaction,
) => db().query<T>(sql, { type: QueryTypes.SELECT, replacements, transaction });

/** A pin's name as the wire list shows it ("V1-3"). */
async function nameOf(pinId: number, t: Transaction): Promise<string> {
  const [row] = await select<{ label: string; cavity: string }>(
    `SELECT c.label, p.cavity FROM pins p JOIN connectors c ON c.id = p.connector_id
      WHERE p.id = :pinId`,
    { pinId },
    t,
  );
  return row ? cavityName(row.label, row.cavity) : `pin ${pinId}`;
}

/**
 * After pins' destinations changed (`before` holds each pin's old destination pin): a wire that
 * ran straight from the pin to its old destination now ends at the new one, or at an end to be
 * fastened again when the destination was cleared; a pin given a destination and no wire at all
 * gets one. Wires through splices are the builder's own and are left as they are.
 */
export async function wiresFollowPins(
  actor: Actor,
  pins: Iterable<Pin>,
  before: Map<number, number | null>,
  t: Transaction,
): Promise<void> {
  for (const pin of pins) {
    const from = before.get(pin.id) ?? null;
    const to = pin.destinationPinId ?? null;
    if (from === to) continue;
    const now = new Date().toISOString();
    const [direct] =
      from == null
        ? []
        : await select<{ wireId: number; label: string; farIndex: number }>(
            `SELECT w.id AS "wireId", w.label, b.end_index AS "farIndex"
               FROM wires w
               JOIN wire_ends a ON a.wire_id = w.id AND a.kind = 'pin' AND a.pin_id = :pinId
               JOIN wire_ends b ON b.wire_id = w.id AND b.end_index <> a.end_index
                AND b.kind = 'pin' AND b.pin_id = :from
              ORDER BY w.id LIMIT 1`,
            { pinId: pin.id, from },
            t,
          );
    if (direct) {
      const pinName = await nameOf(pin.id, t);
      const fromName = await nameOf(from!, t);
      const toName = to == null ? null : await nameOf(to, t);
      await db().query(
        to == null
          ? `UPDATE wire_ends SET kind = 'unresolved', pin_id = NULL, text = :text
              WHERE wire_id = :wireId AND end_index = :farIndex`
          : `UPDATE wire_ends SET pin_id = :to WHERE wire_id = :wireId AND end_index = :farIndex`,
        {
          type: QueryTypes.UPDATE,
          replacements: { ...direct, to, text: `was ${fromName}` },
          transaction: t,
        },
      );
      await db().query(
        'UPDATE wires SET version = version + 1, updated_at = :now WHERE id = :wireId',
        { type: QueryTypes.UPDATE, replacements: { wireId: direct.wireId, now }, transaction: t },
      );
      await recordAudit(t, actor, {
        conversionId: pin.conversionId,
        action: 'update',
        entityType: 'wire',
        entityId: direct.wireId,
        summary: toName
          ? `Wire ${direct.label} follows ${pinName} from ${fromName} to ${toName}`
          : `Wire ${direct.label} left ${fromName}: ${pinName} has no destination`,
      });
      continue;
    }
    if (to == null) continue;
    const [{ n }] = (await select<{ n: number }>(
      `SELECT COUNT(*) AS n FROM wire_ends WHERE kind = 'pin' AND pin_id = :pinId`,
      { pinId: pin.id },
      t,
    )) as [{ n: number }];
    if (Number(n) > 0) continue;
    const pinName = await nameOf(pin.id, t);
    const label = await nextLabel('wires', pin.conversionId, 'W-', 3, t);
    const wireId = await insertReturningId(
      db(),
      `INSERT INTO wires (conversion_id, label, colour, size_mm2, insulation_rating_c, length_m,
         zone, branch, notes, twist_group, shielded, version, created_at, updated_at)
       VALUES (:conversionId, :label, :colour, :size, :insulation, NULL, 'cabin', '', '', '',
         :shielded, 0, :now, :now)`,
      {
        replacements: {
          conversionId: pin.conversionId,
          label,
          colour: pin.colour ?? '',
          size: pin.sizeMm2 ?? null,
          insulation: pin.insulationRatingC ?? null,
          shielded: false,
          now,
        },
        transaction: t,
      },
    );
    await writeEnds(
      wireId,
      [
        { kind: 'pin', refId: pin.id },
        { kind: 'pin', refId: to },
      ],
      t,
    );
    await recordAudit(t, actor, {
      conversionId: pin.conversionId,
      action: 'create',
      entityType: 'wire',
      entityId: wireId,
      summary: `Added wire ${label} from ${pinName} to ${await nameOf(to, t)}`,
    });
  }
}
