import type { Sequelize, Transaction } from 'sequelize';
import { SequelizeStorage, Umzug } from 'umzug';
import { foundation } from './0001-foundation.ts';
import { pinMap } from './0002-pin-map.ts';
import { feeds } from './0003-feeds.ts';
import { importsLibrary } from './0004-imports-library.ts';
import { reviews } from './0005-reviews.ts';
import { bench } from './0006-bench.ts';
import { benchItems } from './0007-bench-items.ts';
import { seals } from './0008-seals.ts';
import { changeCounters } from './0009-change-counters.ts';
import { electricalRules } from './0010-electrical-rules.ts';
import { harness } from './0011-harness.ts';
import { signals } from './0012-signals.ts';
import { commentAnswers } from './0013-comment-answers.ts';
import { POSTGRES_AFTER, POSTGRES_BEFORE, postgresMigrationContext } from './postgres.ts';
import { wirePairs } from './0014-wire-pairs.ts';
import { harnessChangeCounters } from './0015-harness-change-counters.ts';
import { partialPinLinks } from './0016-partial-pin-links.ts';
import { pinChecksAsComparisons } from './0017-pin-checks-as-comparisons.ts';

/**
 * Column types in migrations: Sequelize's sqlite dialect converts values by the declared column
 * type (PRAGMA table_info), so dates are DATETIME and flags BOOLEAN, never plain TEXT/INTEGER.
 */
export interface Migration {
  name: string;
  /** Runs inside the migration's transaction: pass `{ transaction }` to every query. */
  up: (sequelize: Sequelize, transaction: Transaction) => Promise<void>;
}

/** Every migration in order. Add new ones at the end; never edit one that has shipped. */
export const MIGRATIONS: Migration[] = [
  foundation,
  pinMap,
  feeds,
  importsLibrary,
  reviews,
  bench,
  benchItems,
  seals,
  changeCounters,
  electricalRules,
  harness,
  signals,
  commentAnswers,
  wirePairs,
  harnessChangeCounters,
  partialPinLinks,
  pinChecksAsComparisons,
];

export async function migrate(sequelize: Sequelize): Promise<void> {
  const postgres = sequelize.getDialect() === 'postgres';
  const umzug = new Umzug<Sequelize>({
    migrations: MIGRATIONS.map((m) => ({
      name: m.name,
      // Each migration is all-or-nothing.
      up: async ({ context }: { context: Sequelize }) => {
        if (!postgres) {
          await context.transaction((t) => m.up(context, t));
          return;
        }
        // The same migration in PostgreSQL's words (./postgres.ts).
        await context.transaction(async (transaction) => {
          for (const sql of POSTGRES_BEFORE[m.name] ?? []) {
            await context.query(sql, { transaction });
          }
          await m.up(postgresMigrationContext(context), transaction);
          for (const sql of POSTGRES_AFTER[m.name] ?? []) {
            await context.query(sql, { transaction });
          }
        });
      },
    })),
    context: sequelize,
    storage: new SequelizeStorage({ sequelize, tableName: 'schema_migrations' }),
    logger: undefined,
  });
  if (!postgres) {
    await umzug.up();
    return;
  }
  // Several processes may start together on one database: one migrates, the others wait for it
  // (a lock held until this transaction ends) and then find nothing left to do.
  await sequelize.transaction(async (transaction) => {
    await sequelize.query('SET LOCAL lock_timeout = 0', { transaction });
    await sequelize.query(`SELECT pg_advisory_xact_lock(${MIGRATION_LOCK})`, { transaction });
    await umzug.up();
  });
}

/** Any fixed number: the advisory lock that one migrating process holds at a time. */
const MIGRATION_LOCK = 20_517_015;
