/**
 * `npm run seed`: puts the demo workshop into DATABASE_PATH (default data/loomwright.sqlite).
 * A database that already holds a workshop is left alone unless `--reset` is given, which deletes
 * the file (and its -wal/-shm companions) first.
 */
import { existsSync, rmSync } from 'node:fs';
import { loadEnv } from '../server/config/env.ts';
import { closeDatabase, connectDatabase } from '../server/db/index.ts';
import { isEmpty, seedDemo } from './seed-demo.ts';

const env = loadEnv();
if (process.argv.includes('--reset')) {
  for (const suffix of ['', '-wal', '-shm']) {
    const file = env.DATABASE_PATH + suffix;
    if (existsSync(file)) rmSync(file);
  }
}
const sequelize = await connectDatabase(env.DATABASE_PATH);
if (await isEmpty()) {
  await seedDemo(sequelize, {
    password: env.DEMO_PASSWORD,
    bcryptCost: env.BCRYPT_COST,
    sealKeyPem: env.SEAL_PRIVATE_KEY,
  });
  process.stdout.write(`Seeded the demo workshop into ${env.DATABASE_PATH}\n`);
} else {
  process.stdout.write(
    `${env.DATABASE_PATH} already holds a workshop; use --reset to start over\n`,
  );
}
await closeDatabase();
