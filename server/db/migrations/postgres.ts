import type { Sequelize } from 'sequelize';
import { HARNESS_DIRECT, HARNESS_THROUGH } from './0015-harness-change-counters.ts';

/**
 * The PostgreSQL side of the migrations (docs/decisions/0015-postgresql.md). The migrations are
 * written in SQLite's SQL and stay as they shipped; on PostgreSQL each statement goes through
 * `toPostgres` (column types, defaults) and the triggers, which have no common syntax, are
 * written again below in PL/pgSQL and run after the migration that declares them, in the same
 * transaction. One migration history serves both: the names in `schema_migrations` are the same.
 *
 * Every PostgreSQL database is created by running these migrations in one go on empty tables (no
 * PostgreSQL database predates them), so statements that only carry SQLite rows forward are
 * skipped here. Migrations written from now on must run on both dialects as they stand.
 */

/** Rewrites one statement of a migration for PostgreSQL; `null` skips it. */
export function toPostgres(sql: string): string | null {
  const head = sql.trimStart();
  // SQLite's trigger syntax; the PL/pgSQL ones are in POSTGRES_AFTER.
  if (/^CREATE TRIGGER/i.test(head)) return null;
  // 0007 re-keys existing bench records with SQLite's JSON functions: there are none here.
  if (/^INSERT INTO bench_records_next/i.test(head)) return null;
  return (
    sql
      .replace(/\bINTEGER PRIMARY KEY AUTOINCREMENT\b/g, 'SERIAL PRIMARY KEY')
      .replace(/\bDATETIME\b/g, 'TIMESTAMPTZ')
      .replace(/\bREAL\b/g, 'DOUBLE PRECISION')
      .replace(/\b(BOOLEAN NOT NULL DEFAULT) ([01])\b/g, (_, d: string, v: string) =>
        v === '1' ? `${d} TRUE` : `${d} FALSE`,
      )
      // Addresses are stored lower-cased (the schemas do it); the index below keeps them unique so.
      .replace(/\s+COLLATE NOCASE\b/g, '')
      // A flag compared or written as a number (0004's built-in template).
      .replace(/\bbuilt_in = 1\b/g, 'built_in = TRUE')
      .replace(/VALUES \(NULL, 1, :name/, 'VALUES (NULL, TRUE, :name')
  );
}

/** Raises the message given as the trigger's argument: a refused UPDATE, DELETE or INSERT. */
const REFUSE = `CREATE FUNCTION loomwright_refuse() RETURNS trigger LANGUAGE plpgsql AS $$
  BEGIN
    RAISE EXCEPTION USING MESSAGE = TG_ARGV[0], ERRCODE = 'integrity_constraint_violation';
  END $$`;

const refuse = (name: string, timing: string, table: string, message: string, when = '') =>
  `CREATE TRIGGER ${name} ${timing} ON ${table} FOR EACH ROW ${when ? `WHEN (${when}) ` : ''}` +
  `EXECUTE FUNCTION loomwright_refuse('${message.replace(/'/g, "''")}')`;

/** 0009's change counter, moved by a row-level trigger on each table a conversion's lists read. */
function changeCounter(table: string, conversionIdOf: (row: 'NEW' | 'OLD') => string): string[] {
  return [
    `CREATE FUNCTION ${table}_changes() RETURNS trigger LANGUAGE plpgsql AS $$
      BEGIN
        IF TG_OP <> 'DELETE' THEN PERFORM conversion_changes_bump(${conversionIdOf('NEW')}); END IF;
        IF TG_OP <> 'INSERT' THEN PERFORM conversion_changes_bump(${conversionIdOf('OLD')}); END IF;
        RETURN NULL;
      END $$`,
    `CREATE TRIGGER ${table}_changes AFTER INSERT OR UPDATE OR DELETE ON ${table}
      FOR EACH ROW EXECUTE FUNCTION ${table}_changes()`,
  ];
}

/** Statements run on PostgreSQL after the named migration, in its transaction. */
export const POSTGRES_AFTER: Record<string, string[]> = {
  '0001-foundation': [
    REFUSE,
    refuse(
      'audit_events_no_update',
      'BEFORE UPDATE',
      'audit_events',
      'audit_events is append-only',
    ),
    refuse(
      'audit_events_no_delete',
      'BEFORE DELETE',
      'audit_events',
      'audit_events is append-only',
    ),
    `CREATE UNIQUE INDEX users_email_lower ON users (lower(email))`,
  ],
  '0004-imports-library': [
    ...['UPDATE', 'DELETE'].map((op) =>
      refuse(
        `pinout_templates_builtin_no_${op.toLowerCase()}`,
        `BEFORE ${op}`,
        'pinout_templates',
        'built-in templates are read-only',
        'OLD.built_in',
      ),
    ),
    `CREATE FUNCTION pinout_template_pins_builtin() RETURNS trigger LANGUAGE plpgsql AS $$
      BEGIN
        IF (SELECT built_in FROM pinout_templates
             WHERE id = CASE WHEN TG_OP = 'INSERT' THEN NEW.template_id ELSE OLD.template_id END)
        THEN
          RAISE EXCEPTION USING MESSAGE = 'built-in templates are read-only',
            ERRCODE = 'integrity_constraint_violation';
        END IF;
        RETURN CASE WHEN TG_OP = 'DELETE' THEN OLD ELSE NEW END;
      END $$`,
    `CREATE TRIGGER pinout_template_pins_builtin BEFORE INSERT OR UPDATE OR DELETE
      ON pinout_template_pins FOR EACH ROW EXECUTE FUNCTION pinout_template_pins_builtin()`,
  ],
  '0005-reviews': [
    refuse(
      'revisions_frozen_content',
      'BEFORE UPDATE OF snapshot_json, findings_json, hash, number, conversion_id, submitted_by_id, submitted_at',
      'revisions',
      "a revision's snapshot is immutable",
    ),
    refuse(
      'revisions_signed_immutable',
      'BEFORE UPDATE',
      'revisions',
      'a signed-off revision is immutable',
      'OLD.signed_at IS NOT NULL',
    ),
    refuse('revisions_no_delete', 'BEFORE DELETE', 'revisions', 'revisions are never deleted'),
    refuse(
      'review_comments_append_only',
      'BEFORE UPDATE',
      'review_comments',
      'review comments are append-only',
    ),
  ],
  '0008-seals': [
    refuse(
      'revisions_decided_immutable',
      'BEFORE UPDATE',
      'revisions',
      'a decided revision is immutable',
      "OLD.status <> 'in_review'",
    ),
    `CREATE FUNCTION review_comments_kept_once_decided() RETURNS trigger LANGUAGE plpgsql AS $$
      BEGIN
        IF (SELECT status FROM revisions WHERE id = OLD.revision_id) <> 'in_review' THEN
          RAISE EXCEPTION USING MESSAGE = 'comments on a decided revision are kept',
            ERRCODE = 'integrity_constraint_violation';
        END IF;
        RETURN OLD;
      END $$`,
    `CREATE TRIGGER review_comments_kept_once_decided BEFORE DELETE ON review_comments
      FOR EACH ROW EXECUTE FUNCTION review_comments_kept_once_decided()`,
  ],
  '0009-change-counters': [
    `CREATE FUNCTION conversion_changes_bump(conversion integer) RETURNS void LANGUAGE plpgsql AS $$
      BEGIN
        IF conversion IS NOT NULL THEN
          INSERT INTO conversion_changes (conversion_id, counter) VALUES (conversion, 1)
            ON CONFLICT (conversion_id) DO UPDATE SET counter = conversion_changes.counter + 1;
        END IF;
      END $$`,
    ...changeCounter('conversions', (row) => `${row}.id`),
    ...['pins', 'connectors', 'feeds'].flatMap((table) =>
      changeCounter(table, (row) => `${row}.conversion_id`),
    ),
    ...changeCounter(
      'feed_loads',
      (row) => `(SELECT conversion_id FROM feeds WHERE id = ${row}.feed_id)`,
    ),
  ],
  '0013-comment-answers': [
    refuse(
      'review_comment_answers_kept',
      'BEFORE UPDATE',
      'review_comment_answers',
      'an answer is recorded once',
    ),
  ],
  '0015-harness-change-counters': [
    ...HARNESS_DIRECT.flatMap((table) => changeCounter(table, (row) => `${row}.conversion_id`)),
    ...Object.entries(HARNESS_THROUGH).flatMap(([table, of]) => changeCounter(table, of)),
  ],
};

/** Statements run on PostgreSQL before the named migration, in its transaction. */
export const POSTGRES_BEFORE: Record<string, string[]> = {
  // 0007's CHECKs use SQLite's json_valid.
  '0007-bench-items': [
    `CREATE FUNCTION json_valid(document text) RETURNS boolean LANGUAGE plpgsql IMMUTABLE AS $$
      BEGIN
        PERFORM document::jsonb;
        RETURN true;
      EXCEPTION WHEN others THEN
        RETURN false;
      END $$`,
  ],
};

/**
 * The database as a migration sees it on PostgreSQL: the same Sequelize, whose `query` rewrites
 * each statement with `toPostgres` first.
 */
export function postgresMigrationContext(sequelize: Sequelize): Sequelize {
  const query = sequelize.query.bind(sequelize) as (sql: string, options?: object) => unknown;
  return new Proxy(sequelize, {
    get(target, property, receiver) {
      if (property !== 'query') return Reflect.get(target, property, receiver) as unknown;
      return async (sql: string, options?: object) => {
        const rewritten = toPostgres(sql);
        return rewritten === null ? [[], 0] : query(rewritten, options);
      };
    },
  });
}
