/**
 * One writer at a time inside the process, and no SQLite handle left behind by a failed
 * transaction (docs/decisions/0010-write-queue-and-seal.md).
 */
import { readdirSync, readlinkSync } from 'node:fs';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { db } from '#server/db/index.ts';
import { Conversion } from '#server/db/models/index.ts';
import { inTransaction } from '#server/lib/transaction.ts';
import { createTestContext, onPostgres, type TestContext } from '../helpers/test-app.ts';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestContext();
});
afterAll(() => ctx.close());

/** Descriptors this process holds on the database file and its -wal/-shm companions. */
function databaseHandles(): number {
  return readdirSync('/proc/self/fd').filter((fd) => {
    try {
      return readlinkSync(`/proc/self/fd/${fd}`).startsWith(ctx.databasePath);
    } catch {
      return false;
    }
  }).length;
}

describe('the write queue', () => {
  it('runs write transactions one after another and commits every one', async () => {
    let inside = 0;
    let mostAtOnce = 0;
    const before = await Conversion.count();
    const conversion = await Conversion.findOne();
    await Promise.all(
      Array.from({ length: 12 }, (_, i) =>
        inTransaction(db(), async (t) => {
          inside++;
          mostAtOnce = Math.max(mostAtOnce, inside);
          const row = await Conversion.findByPk(conversion!.id, { transaction: t });
          await new Promise((r) => setTimeout(r, 5));
          await row!.update({ notes: `queued write ${i}` }, { transaction: t });
          inside--;
        }),
      ),
    );
    expect(mostAtOnce).toBe(1);
    expect(await Conversion.count()).toBe(before);
    await conversion!.reload();
    expect(conversion!.version).toBeGreaterThanOrEqual(12);
  });

  it('refuses to wait for its own turn: a nested call must pass the transaction down', async () => {
    await expect(
      inTransaction(db(), () => inTransaction(db(), async () => 'never')),
    ).rejects.toThrow(/pass the transaction/);
    // The queue is free again afterwards.
    expect(await inTransaction(db(), async () => 'next')).toBe('next');
  });

  it('keeps the write queue released when the work throws', async () => {
    await expect(
      inTransaction(db(), async () => {
        throw new Error('boom');
      }),
    ).rejects.toThrow('boom');
    expect(await inTransaction(db(), async () => 'after')).toBe('after');
  });
});

// SQLite's file handles; PostgreSQL has a connection pool instead.
describe.skipIf(onPostgres)('handles on the database file', () => {
  it('do not grow when writes fail because another process holds the lock', async () => {
    const auth = await ctx.authFor('builder');
    const write = (name: string) =>
      request(ctx.app).post('/api/conversions').set('Authorization', auth).send({
        name,
        donorEngine: 'KT-20',
        receivingVehicle: 'Corran 100',
        systemVoltage: 12,
      });
    expect((await write('Warm-up')).status).toBe(201);
    const baseline = databaseHandles();

    const sqlite3 = (await import('sqlite3')).default;
    const blockedRound = async (round: number) => {
      const holder = new sqlite3.Database(ctx.databasePath);
      const run = (sql: string) =>
        new Promise<void>((resolve, reject) =>
          holder.run(sql, (err) => (err ? reject(err) : resolve())),
        );
      await run('BEGIN IMMEDIATE');
      try {
        expect((await write(`Blocked ${round}`)).status).toBe(503);
      } finally {
        await run('ROLLBACK');
        await new Promise<void>((resolve) => holder.close(() => resolve()));
      }
      expect((await write(`Afterwards ${round}`)).status).toBe(201);
      return databaseHandles();
    };
    const afterFirst = await blockedRound(1);
    const afterSecond = await blockedRound(2);
    // SQLite may keep one descriptor of a closed handle for reuse while other handles on the same
    // file hold locks (os_unix.c, "unused file descriptors"); beyond that nothing may stay open.
    expect(afterFirst).toBeLessThanOrEqual(baseline + 1);
    expect(afterSecond).toBeLessThanOrEqual(afterFirst);
  }, 30_000);
});
