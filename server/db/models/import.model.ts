import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';

/** One applied pinout import, kept with the file's SHA-256 so a re-upload can be recognised. */
export class PinImport extends Model<
  InferAttributes<PinImport>,
  InferCreationAttributes<PinImport>
> {
  declare id: CreationOptional<number>;
  declare workshopId: number;
  declare conversionId: number;
  declare connectorId: number | null;
  declare fileName: string;
  declare sha256: string;
  declare rowCount: number;
  declare addedCount: number;
  declare changedCount: number;
  declare removedCount: number;
  declare importedById: number | null;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    PinImport.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        workshopId: { type: DataTypes.INTEGER, allowNull: false },
        conversionId: { type: DataTypes.INTEGER, allowNull: false },
        connectorId: { type: DataTypes.INTEGER, allowNull: true },
        fileName: { type: DataTypes.TEXT, allowNull: false },
        sha256: { type: DataTypes.TEXT, allowNull: false },
        rowCount: { type: DataTypes.INTEGER, allowNull: false },
        addedCount: { type: DataTypes.INTEGER, allowNull: false },
        changedCount: { type: DataTypes.INTEGER, allowNull: false },
        removedCount: { type: DataTypes.INTEGER, allowNull: false },
        importedById: { type: DataTypes.INTEGER, allowNull: true },
        createdAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'pin_imports', updatedAt: false },
    );
  }
}

/** The column choices a workshop last applied to a file with exactly these headers. */
export class ImportMapping extends Model<
  InferAttributes<ImportMapping>,
  InferCreationAttributes<ImportMapping>
> {
  declare id: CreationOptional<number>;
  declare workshopId: number;
  declare headerSignature: string;
  declare headersJson: string;
  /** JSON array: the target of each column, by position. */
  declare targetsJson: string;
  declare updatedById: number | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    ImportMapping.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        workshopId: { type: DataTypes.INTEGER, allowNull: false },
        headerSignature: { type: DataTypes.TEXT, allowNull: false },
        headersJson: { type: DataTypes.TEXT, allowNull: false },
        targetsJson: { type: DataTypes.TEXT, allowNull: false },
        updatedById: { type: DataTypes.INTEGER, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'import_mappings' },
    );
  }
}
