import type { Migration } from './index.ts';

/**
 * Bench records for everything built from a revision, not only pins: each record names its item by
 * a key that stays the same across revisions ("pin:E1-12", "feed:3", a test-plan step), holds the
 * ticks that item offers and one reading in the unit it asks for, and says whether it was carried
 * over from an earlier revision or is rework owed from one. Photos taken at the bench are
 * attachments of a record's item.
 */
export const benchItems: Migration = {
  name: '0007-bench-items',
  async up(sequelize, transaction) {
    const statements = [
      `CREATE TABLE bench_records_next (
        id INTEGER PRIMARY KEY AUTOINCREMENT,
        revision_id INTEGER NOT NULL REFERENCES revisions(id),
        item_key TEXT NOT NULL CHECK (length(item_key) BETWEEN 3 AND 200),
        ticks_json TEXT NOT NULL DEFAULT '{}' CHECK (json_valid(ticks_json)),
        reading REAL,
        note TEXT NOT NULL DEFAULT '',
        carried_from INTEGER,
        rework_json TEXT CHECK (rework_json IS NULL OR json_valid(rework_json)),
        recorded_by_id INTEGER REFERENCES users(id),
        recorded_by_name TEXT NOT NULL,
        version INTEGER NOT NULL DEFAULT 0,
        created_at DATETIME NOT NULL,
        updated_at DATETIME NOT NULL,
        UNIQUE (revision_id, item_key)
      )`,
      // A pin's record is now keyed by its cavity name, read from the revision's frozen snapshot.
      `INSERT INTO bench_records_next
        (id, revision_id, item_key, ticks_json, reading, note, recorded_by_id, recorded_by_name,
         version, created_at, updated_at)
       SELECT b.id, b.revision_id,
         COALESCE(
           (SELECT 'pin:' || json_extract(c.value, '$.label') || '-' || json_extract(p.value, '$.cavity')
              FROM revisions r, json_each(r.snapshot_json, '$.pins') p,
                   json_each(r.snapshot_json, '$.connectors') c
             WHERE r.id = b.revision_id
               AND json_extract(p.value, '$.id') = b.pin_id
               AND json_extract(c.value, '$.id') = json_extract(p.value, '$.connectorId')),
           'pin:#' || b.pin_id),
         json_object('done', json(CASE WHEN b.done THEN 'true' ELSE 'false' END),
                     'tested', json(CASE WHEN b.tested THEN 'true' ELSE 'false' END)),
         b.resistance_ohm, b.note, b.recorded_by_id, b.recorded_by_name, b.version,
         b.created_at, b.updated_at
       FROM bench_records b`,
      `DROP TABLE bench_records`,
      `ALTER TABLE bench_records_next RENAME TO bench_records`,
      // Photos from the bench: an attachment belongs to a connector (reference scans) or to a bench
      // item of a revision.
      `CREATE TABLE bench_photos (
        id INTEGER PRIMARY KEY AUTOINCREMENT,
        workshop_id INTEGER NOT NULL REFERENCES workshops(id) ON DELETE CASCADE,
        revision_id INTEGER NOT NULL REFERENCES revisions(id),
        item_key TEXT NOT NULL CHECK (length(item_key) BETWEEN 3 AND 200),
        storage_key TEXT NOT NULL UNIQUE,
        file_name TEXT NOT NULL,
        content_type TEXT NOT NULL CHECK (content_type IN ('image/png', 'image/jpeg')),
        size_bytes INTEGER NOT NULL CHECK (size_bytes > 0),
        sha256 TEXT NOT NULL,
        taken_by_id INTEGER REFERENCES users(id) ON DELETE SET NULL,
        taken_by_name TEXT NOT NULL,
        created_at DATETIME NOT NULL
      )`,
      `CREATE INDEX bench_photos_item ON bench_photos(revision_id, item_key)`,
    ];
    for (const sql of statements) await sequelize.query(sql, { transaction });
  },
};
