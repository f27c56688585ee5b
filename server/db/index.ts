import type { Sequelize } from 'sequelize';
import { migrate } from './migrations/index.ts';
import { initModels } from './models/index.ts';
import { isPostgresUrl, openPostgres } from './postgres.ts';
import { openDatabase } from './sequelize.ts';

let current: Sequelize | null = null;
const closeHooks: Array<() => void | Promise<void>> = [];

/**
 * Opens the database (a SQLite file, or PostgreSQL for a `postgres://` URL), brings its schema up
 * to date and binds the models to it.
 */
export async function connectDatabase(target: string): Promise<Sequelize> {
  const sequelize = isPostgresUrl(target) ? await openPostgres(target) : await openDatabase(target);
  await migrate(sequelize);
  initModels(sequelize);
  current = sequelize;
  return sequelize;
}

/** The database this process works with. */
export function db(): Sequelize {
  if (!current) throw new Error('The database is not connected yet');
  return current;
}

/** Runs `hook` whenever the database closes: caches of its rows must not outlive it. */
export function onDatabaseClose(hook: () => void | Promise<void>): void {
  closeHooks.push(hook);
}

export async function closeDatabase(): Promise<void> {
  for (const hook of closeHooks) await hook();
  if (current) await current.close();
  current = null;
}

/** Where the configured database lives: DATABASE_URL when set, else the SQLite file. */
export function databaseTarget(env: { DATABASE_URL?: string; DATABASE_PATH: string }): string {
  return env.DATABASE_URL ?? env.DATABASE_PATH;
}
