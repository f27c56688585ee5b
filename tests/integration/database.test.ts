/**
 * The SQLite settings that keep concurrent writers safe (docs/decisions/0002-sqlite-settings.md),
 * and what holds on either database: foreign keys, the append-only audit trail, a 503 when another
 * writer holds the lock too long (docs/decisions/0015-postgresql.md).
 */
import { ForeignKeyConstraintError, QueryTypes } from 'sequelize';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { db } from '#server/db/index.ts';
import { AuditEvent, Conversion } from '#server/db/models/index.ts';
import { createTestContext, onPostgres, type TestContext } from '../helpers/test-app.ts';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestContext();
});
afterAll(() => ctx.close());

async function pragma(name: string, transaction?: import('sequelize').Transaction) {
  const rows = await db().query<Record<string, unknown>>(`PRAGMA ${name}`, {
    transaction,
    type: QueryTypes.SELECT,
  });
  return Object.values(rows[0]!)[0];
}

describe.skipIf(onPostgres)('SQLite settings', () => {
  it('uses WAL', async () => {
    expect(await pragma('journal_mode')).toBe('wal');
  });

  it('sets busy_timeout 5000, synchronous FULL and foreign keys on inside a transaction', async () => {
    await db().transaction(async (t) => {
      expect(await pragma('busy_timeout', t)).toBe(5000);
      expect(await pragma('synchronous', t)).toBe(2);
      expect(await pragma('foreign_keys', t)).toBe(1);
    });
  });

  it('keeps the database files readable by their owner only', async () => {
    const { statSync, existsSync } = await import('node:fs');
    for (const file of [ctx.databasePath, `${ctx.databasePath}-wal`, `${ctx.databasePath}-shm`]) {
      if (existsSync(file)) expect(statSync(file).mode & 0o777, file).toBe(0o600);
    }
  });

  it('passes the integrity check', async () => {
    expect(await pragma('integrity_check')).toBe('ok');
  });
});

describe('on either database', () => {
  it('refuses an orphan row', async () => {
    await expect(
      Conversion.create({
        workshopId: 424242,
        name: 'x',
        donorEngine: 'x',
        receivingVehicle: 'x',
        systemVoltage: 12,
      }),
    ).rejects.toBeInstanceOf(ForeignKeyConstraintError);
  });

  it('keeps the audit trail append-only', async () => {
    const event = await AuditEvent.findOne();
    const row =
      event ??
      (await AuditEvent.create({
        workshopId: 1,
        actorId: null,
        actorName: 't',
        action: 'test',
        entityType: 't',
        entityId: null,
        summary: 't',
        conversionId: null,
        beforeJson: null,
        afterJson: null,
        requestId: null,
      }));
    const refusal = (sql: string) =>
      db()
        .query(sql)
        .then(
          () => 'accepted',
          (err: { parent?: Error }) => String(err.parent?.message),
        );
    expect(await refusal(`UPDATE audit_events SET summary = 'x' WHERE id = ${row.id}`)).toMatch(
      /append-only/,
    );
    expect(await refusal(`DELETE FROM audit_events WHERE id = ${row.id}`)).toMatch(/append-only/);
  });
});

/**
 * Another process holding the write lock: on SQLite a `BEGIN IMMEDIATE` from another handle, on
 * PostgreSQL another session holding the conversions table locked against inserts.
 */
async function holdWriteLock(): Promise<{ release: () => Promise<void> }> {
  if (onPostgres) {
    const pg = (await import('pg')).default;
    const holder = new pg.Client({ connectionString: ctx.env.DATABASE_URL });
    await holder.connect();
    await holder.query('BEGIN');
    await holder.query('LOCK TABLE conversions IN EXCLUSIVE MODE');
    return {
      release: async () => {
        await holder.query('ROLLBACK');
        await holder.end();
      },
    };
  }
  const sqlite3 = (await import('sqlite3')).default;
  const holder = new sqlite3.Database(ctx.databasePath);
  const run = (sql: string) =>
    new Promise<void>((resolve, reject) =>
      holder.run(sql, (err) => (err ? reject(err) : resolve())),
    );
  await run('BEGIN IMMEDIATE');
  return {
    release: async () => {
      await run('ROLLBACK');
      await new Promise<void>((resolve) => holder.close(() => resolve()));
    },
  };
}

describe('a database held busy by another writer', () => {
  it('answers a write with 503 and Retry-After after waiting, writes nothing, and recovers', async () => {
    const request = (await import('supertest')).default;
    const lock = await holdWriteLock();
    const before = await Conversion.count();
    const auth = await ctx.authFor('builder');
    try {
      const started = Date.now();
      const res = await request(ctx.app).post('/api/conversions').set('Authorization', auth).send({
        name: 'Blocked',
        donorEngine: 'KT-20',
        receivingVehicle: 'Corran 100',
        systemVoltage: 12,
      });
      expect(res.status).toBe(503);
      expect(res.headers['retry-after']).toBe('2');
      expect(res.body.error.code).toBe('busy');
      expect(JSON.stringify(res.body)).not.toMatch(/SQLITE|lock/);
      // It waited out the 5 s busy (or lock) timeout rather than failing at once.
      expect(Date.now() - started).toBeGreaterThan(4000);
    } finally {
      await lock.release();
    }
    expect(await Conversion.count()).toBe(before);
    const after = await request(ctx.app).post('/api/conversions').set('Authorization', auth).send({
      name: 'Unblocked',
      donorEngine: 'KT-20',
      receivingVehicle: 'Corran 100',
      systemVoltage: 12,
    });
    expect(after.status).toBe(201);
  }, 30_000);
});
