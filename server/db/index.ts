import type { Sequelize } from 'sequelize';
import { migrate } from './migrations/index.ts';
import { initModels } from './models/index.ts';
import { openDatabase } from './sequelize.ts';

let current: Sequelize | null = null;
const closeHooks: Array<() => void | Promise<void>> = [];

/** Opens the database file, brings its schema up to date and binds the models to it. */
export async function connectDatabase(storage: string): Promise<Sequelize> {
  const sequelize = await openDatabase(storage);
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
