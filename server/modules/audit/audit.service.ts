import type { Transaction } from 'sequelize';
import type { Actor } from '../../lib/actor.ts';
import { AuditEvent } from '../../db/models/index.ts';

export interface AuditEntry {
  conversionId?: number | null;
  action: string;
  entityType: string;
  entityId?: number | null;
  summary: string;
  before?: unknown;
  after?: unknown;
}

/** Appends one line to the audit trail inside the caller's transaction. */
export async function recordAudit(
  t: Transaction,
  actor: Pick<Actor, 'id' | 'name' | 'workshopId' | 'requestId'>,
  entry: AuditEntry,
): Promise<void> {
  await AuditEvent.create(
    {
      workshopId: actor.workshopId,
      conversionId: entry.conversionId ?? null,
      actorId: actor.id,
      actorName: actor.name,
      action: entry.action,
      entityType: entry.entityType,
      entityId: entry.entityId ?? null,
      summary: entry.summary,
      beforeJson: entry.before === undefined ? null : JSON.stringify(entry.before),
      afterJson: entry.after === undefined ? null : JSON.stringify(entry.after),
      requestId: actor.requestId,
    },
    { transaction: t },
  );
}

/** The fields of `after` that differ from `before`, as {field: [old, new]}. */
export function changedFields<T extends object>(
  before: T,
  after: Partial<T>,
): Partial<Record<keyof T, [unknown, unknown]>> {
  const changes: Partial<Record<keyof T, [unknown, unknown]>> = {};
  for (const key of Object.keys(after) as Array<keyof T>) {
    if (after[key] !== undefined && before[key] !== after[key]) {
      changes[key] = [before[key], after[key]];
    }
  }
  return changes;
}

/** {@link changedFields} as an audit line's `before` and `after`: old and new values by field. */
export function beforeAndAfter(changes: Partial<Record<PropertyKey, [unknown, unknown]>>): {
  before: Record<string, unknown>;
  after: Record<string, unknown>;
} {
  const entries = Object.entries(changes) as Array<[string, [unknown, unknown]]>;
  return {
    before: Object.fromEntries(entries.map(([field, [old]]) => [field, old])),
    after: Object.fromEntries(entries.map(([field, [, now]]) => [field, now])),
  };
}
