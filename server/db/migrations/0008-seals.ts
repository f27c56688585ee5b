import type { Migration } from './index.ts';

/**
 * Seals on reviewers' decisions (docs/decisions/0010-write-queue-and-seal.md): the Ed25519
 * signature and the fingerprint of the key that made it. A decided revision (signed off or sent
 * back) refuses every update, and its review comments can no longer be deleted.
 */
export const seals: Migration = {
  name: '0008-seals',
  async up(sequelize, transaction) {
    const statements = [
      `ALTER TABLE revisions ADD COLUMN seal TEXT`,
      `ALTER TABLE revisions ADD COLUMN seal_key TEXT`,
      `CREATE TRIGGER revisions_decided_immutable BEFORE UPDATE ON revisions
        WHEN OLD.status <> 'in_review'
        BEGIN SELECT RAISE(ABORT, 'a decided revision is immutable'); END`,
      `CREATE TRIGGER review_comments_kept_once_decided BEFORE DELETE ON review_comments
        WHEN (SELECT status FROM revisions WHERE id = OLD.revision_id) <> 'in_review'
        BEGIN SELECT RAISE(ABORT, 'comments on a decided revision are kept'); END`,
    ];
    for (const sql of statements) await sequelize.query(sql, { transaction });
  },
};
