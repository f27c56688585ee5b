import { randomBytes } from 'node:crypto';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { createApp } from '../../server/app.ts';
import { loadEnv } from '../../server/config/env.ts';
import { closeDatabase, connectDatabase } from '../../server/db/index.ts';
import { User } from '../../server/db/models/index.ts';
import { signSessionToken } from '../../server/modules/auth/tokens.ts';
import { seedDemo } from '../../seeds/seed-demo.ts';

/** A demo database in a temporary folder and the app on it, for one bench run. */
export async function benchContext(options: { clientDir?: string } = {}) {
  const dir = mkdtempSync(path.join(tmpdir(), 'loomwright-bench-'));
  const env = loadEnv({
    NODE_ENV: 'production',
    DATABASE_PATH: path.join(dir, 'bench.sqlite'),
    JWT_SECRET: randomBytes(32).toString('base64url'),
    LOG_LEVEL: 'silent',
    LOGIN_LIMIT_PER_MINUTE: '1000',
  });
  const sequelize = await connectDatabase(env.DATABASE_PATH);
  const demo = await seedDemo(sequelize, {
    password: 'loomwright-demo',
    bcryptCost: 10,
    sealKeyPem: env.SEAL_PRIVATE_KEY,
  });
  const app = createApp({ env, clientDir: options.clientDir });
  const builder = await User.findByPk(demo.users.builder!);
  const auth = { Authorization: `Bearer ${signSessionToken(builder!.id, builder!.tokenVersion)}` };
  return {
    app,
    demo,
    sequelize,
    auth,
    close: async () => {
      await closeDatabase();
      rmSync(dir, { recursive: true, force: true });
    },
  };
}
