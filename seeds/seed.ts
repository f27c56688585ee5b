/**
 * `npm run seed`: puts the demo workshop into DATABASE_PATH (default data/loomwright.sqlite), or
 * into the PostgreSQL database at DATABASE_URL (`--reset` is refused there: drop it yourself).
 * A database that already holds a workshop is left alone unless `--reset` is given, which deletes
 * the file (and its -wal/-shm companions) first.
 */
import { existsSync, rmSync } from 'node:fs';
import { loadEnv } from '../server/config/env.ts';
import { closeDatabase, connectDatabase, databaseTarget } from '../server/db/index.ts';
import { isEmpty, seedDemo } from './seed-demo.ts';

const env = loadEnv();
const where = env.DATABASE_URL ? 'the PostgreSQL database' : env.DATABASE_PATH;
if (process.argv.includes('--reset') && env.DATABASE_URL) {
  process.stderr.write(
    '--reset deletes a SQLite file only; drop and create the database instead\n',
  );
  process.exit(1);
}
if (process.argv.includes('--reset')) {
  for (const suffix of ['', '-wal', '-shm']) {
    const file = env.DATABASE_PATH + suffix;
    if (existsSync(file)) rmSync(file);
  }
}
const sequelize = await connectDatabase(databaseTarget(env));
if (await isEmpty()) {
  await seedDemo(sequelize, {
    password: env.DEMO_PASSWORD,
    bcryptCost: env.BCRYPT_COST,
    sealKeyPem: env.SEAL_PRIVATE_KEY,
  });
  process.stdout.write(`Seeded the demo workshop into ${where}\n`);
} else {
  process.stdout.write(`${where} already holds a workshop; use --reset to start over\n`);
}
await closeDatabase();
