import type { Migration } from './index.ts';

/**
 * A builder marks a reviewer's comment answered. Review comments are append-only (0005), so the
 * answer is a row of its own, one per comment, kept as long as the comment.
 */
export const commentAnswers: Migration = {
  name: '0013-comment-answers',
  async up(sequelize, transaction) {
    const statements = [
      `CREATE TABLE review_comment_answers (
        comment_id INTEGER PRIMARY KEY REFERENCES review_comments(id),
        answered_by_id INTEGER REFERENCES users(id),
        answered_by_name TEXT NOT NULL,
        answered_at DATETIME NOT NULL
      )`,
      `CREATE TRIGGER review_comment_answers_kept BEFORE UPDATE ON review_comment_answers
        BEGIN SELECT RAISE(ABORT, 'an answer is recorded once'); END`,
    ];
    for (const sql of statements) await sequelize.query(sql, { transaction });
  },
};
