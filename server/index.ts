import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { DEMO_USERS } from '../seeds/demo-data.ts';
import { isEmpty, seedDemoOnce } from '../seeds/seed-demo.ts';
import { createApp } from './app.ts';
import { EnvError, loadEnv } from './config/env.ts';
import { closeDatabase, connectDatabase, databaseTarget } from './db/index.ts';
import { startFileStore } from './lib/file-store-setup.ts';
import { logger } from './lib/logger.ts';
import { startMail } from './modules/mail/mail-setup.ts';

const projectRoot = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');

async function main() {
  const env = loadEnv();
  const sequelize = await connectDatabase(databaseTarget(env));
  // Never the URL: it may carry a password.
  const database = env.DATABASE_URL ? 'postgresql' : env.DATABASE_PATH;
  let fresh = await isEmpty();
  if (env.DEMO && fresh) {
    // Another process starting on the same new database may seed it first.
    fresh = await seedDemoOnce(sequelize, {
      password: env.DEMO_PASSWORD,
      bcryptCost: env.BCRYPT_COST,
      sealKeyPem: env.SEAL_PRIVATE_KEY,
    });
    if (fresh) logger.info({ database }, 'seeded the demo workshop');
  }
  const stopMail = await startMail(env);
  const stopFileStore = await startFileStore(env);
  const app = createApp({ env, clientDir: path.join(projectRoot, 'dist') });
  const server = app.listen(env.PORT, env.HOST, () => {
    const url = `http://localhost:${env.PORT}`;
    logger.info({ url, database }, 'Loomwright is listening');
    // The demo password is printed once, when the demo is seeded; later starts print none.
    if (env.DEMO && fresh) {
      const lines = DEMO_USERS.map((u) => `  ${u.role.padEnd(11)} ${u.email}`).join('\n');
      process.stdout.write(
        `\nLoomwright is running at ${url}\nDemo workshop sign-ins (password "${env.DEMO_PASSWORD}"):\n${lines}\n\n`,
      );
    }
  });

  const shutdown = (signal: string) => {
    logger.info({ signal }, 'shutting down');
    server.close(() => {
      void stopMail()
        .then(stopFileStore)
        .then(closeDatabase)
        .finally(() => process.exit(0));
    });
    setTimeout(() => process.exit(0), 5000).unref();
  };
  process.on('SIGTERM', () => shutdown('SIGTERM'));
  process.on('SIGINT', () => shutdown('SIGINT'));
}

process.on('uncaughtException', (err) => {
  logger.fatal({ err }, 'uncaught exception; exiting');
  process.exit(1);
});
process.on('unhandledRejection', (err) => {
  logger.fatal({ err }, 'unhandled rejection; exiting');
  process.exit(1);
});

main().catch((err: unknown) => {
  if (err instanceof EnvError) {
    process.stderr.write(`${err.message}\n`);
  } else {
    logger.fatal({ err }, 'failed to start');
  }
  process.exit(1);
});
