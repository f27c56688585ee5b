import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';
import type { RevisionStatus } from '#shared/schemas/revisions.schema.ts';

/** A frozen snapshot of a conversion's plan, its findings and their SHA-256, under review or signed off. */
export class Revision extends Model<InferAttributes<Revision>, InferCreationAttributes<Revision>> {
  declare id: CreationOptional<number>;
  declare conversionId: number;
  declare number: number;
  declare status: RevisionStatus;
  declare snapshotJson: string;
  declare findingsJson: string;
  declare hash: string;
  declare submittedById: number | null;
  declare submittedByName: string;
  declare submittedAt: Date;
  declare reviewedById: CreationOptional<number | null>;
  declare reviewedByName: CreationOptional<string | null>;
  declare reviewedAt: CreationOptional<Date | null>;
  declare signedAt: CreationOptional<Date | null>;
  declare reviewComment: CreationOptional<string>;
  /** Ed25519 signature of the decision (server/lib/seal.ts); null until decided. */
  declare seal: CreationOptional<string | null>;
  /** Fingerprint of the key that made the seal. */
  declare sealKey: CreationOptional<string | null>;
  declare version: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    Revision.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        conversionId: { type: DataTypes.INTEGER, allowNull: false },
        number: { type: DataTypes.INTEGER, allowNull: false },
        status: { type: DataTypes.TEXT, allowNull: false },
        snapshotJson: { type: DataTypes.TEXT, allowNull: false },
        findingsJson: { type: DataTypes.TEXT, allowNull: false },
        hash: { type: DataTypes.TEXT, allowNull: false },
        submittedById: { type: DataTypes.INTEGER, allowNull: true },
        submittedByName: { type: DataTypes.TEXT, allowNull: false },
        submittedAt: { type: DataTypes.DATE, allowNull: false },
        reviewedById: { type: DataTypes.INTEGER, allowNull: true },
        reviewedByName: { type: DataTypes.TEXT, allowNull: true },
        reviewedAt: { type: DataTypes.DATE, allowNull: true },
        signedAt: { type: DataTypes.DATE, allowNull: true },
        reviewComment: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
        seal: { type: DataTypes.TEXT, allowNull: true },
        sealKey: { type: DataTypes.TEXT, allowNull: true },
        version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'revisions', version: true },
    );
  }
}

/** A reviewer's (or builder's) remark on a revision, a pin or a feed of it. Append-only. */
export class ReviewComment extends Model<
  InferAttributes<ReviewComment>,
  InferCreationAttributes<ReviewComment>
> {
  declare id: CreationOptional<number>;
  declare revisionId: number;
  declare authorId: number | null;
  declare authorName: string;
  declare pinId: number | null;
  declare feedId: number | null;
  declare subjectLabel: string;
  declare body: string;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    ReviewComment.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        revisionId: { type: DataTypes.INTEGER, allowNull: false },
        authorId: { type: DataTypes.INTEGER, allowNull: true },
        authorName: { type: DataTypes.TEXT, allowNull: false },
        pinId: { type: DataTypes.INTEGER, allowNull: true },
        feedId: { type: DataTypes.INTEGER, allowNull: true },
        subjectLabel: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
        body: { type: DataTypes.TEXT, allowNull: false },
        createdAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'review_comments', updatedAt: false },
    );
  }
}

/** A builder's mark that a comment has been answered (migration 0013); at most one per comment. */
export class ReviewCommentAnswer extends Model<
  InferAttributes<ReviewCommentAnswer>,
  InferCreationAttributes<ReviewCommentAnswer>
> {
  declare commentId: number;
  declare answeredById: number | null;
  declare answeredByName: string;
  declare answeredAt: Date;

  static initModel(sequelize: Sequelize) {
    ReviewCommentAnswer.init(
      {
        commentId: { type: DataTypes.INTEGER, primaryKey: true },
        answeredById: { type: DataTypes.INTEGER, allowNull: true },
        answeredByName: { type: DataTypes.TEXT, allowNull: false },
        answeredAt: { type: DataTypes.DATE, allowNull: false },
      },
      { sequelize, tableName: 'review_comment_answers', timestamps: false },
    );
  }
}
