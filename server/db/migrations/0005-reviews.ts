import type { Migration } from './index.ts';

export const reviews: Migration = {
  name: '0005-reviews',
  async up(sequelize, transaction) {
    const statements = [
      `CREATE TABLE revisions (
        id INTEGER PRIMARY KEY AUTOINCREMENT,
        conversion_id INTEGER NOT NULL REFERENCES conversions(id),
        number INTEGER NOT NULL,
        status TEXT NOT NULL CHECK (status IN ('in_review', 'changes_requested', 'signed_off')),
        snapshot_json TEXT NOT NULL,
        findings_json TEXT NOT NULL,
        hash TEXT NOT NULL CHECK (length(hash) = 64),
        submitted_by_id INTEGER REFERENCES users(id),
        submitted_by_name TEXT NOT NULL,
        submitted_at DATETIME NOT NULL,
        reviewed_by_id INTEGER REFERENCES users(id),
        reviewed_by_name TEXT,
        reviewed_at DATETIME,
        signed_at DATETIME,
        review_comment TEXT NOT NULL DEFAULT '',
        version INTEGER NOT NULL DEFAULT 0,
        created_at DATETIME NOT NULL,
        updated_at DATETIME NOT NULL,
        UNIQUE (conversion_id, number)
      )`,
      `CREATE INDEX revisions_conversion ON revisions(conversion_id, number)`,
      // What was frozen never changes: the snapshot, its findings and its hash are write-once, a
      // signed-off revision refuses every update, and no revision is ever deleted.
      `CREATE TRIGGER revisions_frozen_content BEFORE UPDATE OF snapshot_json, findings_json, hash, number,
        conversion_id, submitted_by_id, submitted_at ON revisions
        BEGIN SELECT RAISE(ABORT, 'a revision''s snapshot is immutable'); END`,
      `CREATE TRIGGER revisions_signed_immutable BEFORE UPDATE ON revisions
        WHEN OLD.signed_at IS NOT NULL
        BEGIN SELECT RAISE(ABORT, 'a signed-off revision is immutable'); END`,
      `CREATE TRIGGER revisions_no_delete BEFORE DELETE ON revisions
        BEGIN SELECT RAISE(ABORT, 'revisions are never deleted'); END`,
      `CREATE TABLE review_comments (
        id INTEGER PRIMARY KEY AUTOINCREMENT,
        revision_id INTEGER NOT NULL REFERENCES revisions(id),
        author_id INTEGER REFERENCES users(id),
        author_name TEXT NOT NULL,
        pin_id INTEGER,
        feed_id INTEGER,
        subject_label TEXT NOT NULL DEFAULT '',
        body TEXT NOT NULL,
        created_at DATETIME NOT NULL
      )`,
      `CREATE INDEX review_comments_revision ON review_comments(revision_id)`,
      `CREATE TRIGGER review_comments_append_only BEFORE UPDATE ON review_comments
        BEGIN SELECT RAISE(ABORT, 'review comments are append-only'); END`,
      `CREATE TABLE mail_outbox (
        id INTEGER PRIMARY KEY AUTOINCREMENT,
        workshop_id INTEGER NOT NULL REFERENCES workshops(id) ON DELETE CASCADE,
        kind TEXT NOT NULL,
        to_address TEXT NOT NULL,
        subject TEXT NOT NULL,
        text_body TEXT NOT NULL,
        status TEXT NOT NULL DEFAULT 'pending' CHECK (status IN ('pending', 'sending', 'sent', 'failed')),
        attempts INTEGER NOT NULL DEFAULT 0,
        last_error TEXT,
        next_attempt_at DATETIME NOT NULL,
        sent_at DATETIME,
        message_id TEXT,
        created_at DATETIME NOT NULL,
        updated_at DATETIME NOT NULL
      )`,
      `CREATE INDEX mail_outbox_due ON mail_outbox(status, next_attempt_at)`,
      `CREATE TABLE invitations (
        id INTEGER PRIMARY KEY AUTOINCREMENT,
        user_id INTEGER NOT NULL REFERENCES users(id) ON DELETE CASCADE,
        token_hash TEXT NOT NULL UNIQUE,
        expires_at DATETIME NOT NULL,
        used_at DATETIME,
        created_at DATETIME NOT NULL
      )`,
    ];
    for (const sql of statements) await sequelize.query(sql, { transaction });
  },
};
