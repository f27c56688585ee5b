/**
 * Two app processes starting together on one new database both find it empty: the demo workshop
 * is seeded once, and the process that loses the race starts without an error.
 */
import { generateKeyPairSync } from 'node:crypto';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, expect, it } from 'vitest';
import { closeDatabase, connectDatabase } from '#server/db/index.ts';
import { User, Workshop } from '#server/db/models/index.ts';
import { isEmpty, seedDemoOnce } from '../../seeds/seed-demo.ts';
import { TEST_DATABASE_URL, createPostgresDatabase } from '../helpers/test-app.ts';

const dir = mkdtempSync(path.join(tmpdir(), 'loomwright-seed-'));
const postgres = TEST_DATABASE_URL ? await createPostgresDatabase(TEST_DATABASE_URL) : null;
afterAll(async () => {
  await closeDatabase();
  await postgres?.drop();
  rmSync(dir, { recursive: true, force: true });
});

it('seeds the demo workshop once when two starts race on an empty database', async () => {
  const sequelize = await connectDatabase(postgres?.url ?? path.join(dir, 'seed.sqlite'));
  expect(await isEmpty()).toBe(true);
  const sealKeyPem = generateKeyPairSync('ed25519')
    .privateKey.export({ type: 'pkcs8', format: 'pem' })
    .toString();
  const options = { password: 'loomwright-demo', bcryptCost: 4, sealKeyPem };
  const seeded = await Promise.all([
    seedDemoOnce(sequelize, options),
    seedDemoOnce(sequelize, options),
  ]);
  expect(seeded.filter(Boolean)).toHaveLength(1);
  expect(await Workshop.count()).toBe(1);
  expect(await User.count()).toBe(4);
  expect(await seedDemoOnce(sequelize, options)).toBe(false);
});
