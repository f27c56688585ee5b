import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';
import type { AttachmentType } from '#shared/schemas/attachments.schema.ts';

/** A reference scan of a connector: the row; the bytes live in the file store under `storageKey`. */
export class Attachment extends Model<
  InferAttributes<Attachment>,
  InferCreationAttributes<Attachment>
> {
  declare id: CreationOptional<number>;
  declare workshopId: number;
  declare conversionId: number;
  declare connectorId: number;
  /** A generated UUID; never derived from the uploaded file's name. */
  declare storageKey: string;
  declare fileName: string;
  declare contentType: AttachmentType;
  declare sizeBytes: number;
  declare sha256: string;
  declare uploadedById: number | null;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    Attachment.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        workshopId: { type: DataTypes.INTEGER, allowNull: false },
        conversionId: { type: DataTypes.INTEGER, allowNull: false },
        connectorId: { type: DataTypes.INTEGER, allowNull: false },
        storageKey: { type: DataTypes.TEXT, allowNull: false, unique: true },
        fileName: { type: DataTypes.TEXT, allowNull: false },
        contentType: { type: DataTypes.TEXT, allowNull: false },
        sizeBytes: { type: DataTypes.INTEGER, allowNull: false },
        sha256: { type: DataTypes.TEXT, allowNull: false },
        uploadedById: { type: DataTypes.INTEGER, allowNull: true },
        createdAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'attachments', updatedAt: false },
    );
  }
}
