import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';

/**
 * One item's bench work on a signed-off revision: its ticks, one reading, a note; carried over from
 * an earlier revision or owed as rework from one.
 */
export class BenchRecord extends Model<
  InferAttributes<BenchRecord>,
  InferCreationAttributes<BenchRecord>
> {
  declare id: CreationOptional<number>;
  declare revisionId: number;
  declare itemKey: string;
  declare ticksJson: string;
  declare reading: number | null;
  declare note: string;
  declare carriedFrom: number | null;
  declare reworkJson: string | null;
  declare recordedById: number | null;
  declare recordedByName: string;
  declare version: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    BenchRecord.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        revisionId: { type: DataTypes.INTEGER, allowNull: false },
        itemKey: { type: DataTypes.TEXT, allowNull: false },
        ticksJson: { type: DataTypes.TEXT, allowNull: false, defaultValue: '{}' },
        reading: { type: DataTypes.REAL, allowNull: true },
        note: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
        carriedFrom: { type: DataTypes.INTEGER, allowNull: true },
        reworkJson: { type: DataTypes.TEXT, allowNull: true },
        recordedById: { type: DataTypes.INTEGER, allowNull: true },
        recordedByName: { type: DataTypes.TEXT, allowNull: false },
        version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'bench_records', version: true },
    );
  }
}

/** A photo taken at the bench of one item of a revision; the bytes live in the file store. */
export class BenchPhoto extends Model<
  InferAttributes<BenchPhoto>,
  InferCreationAttributes<BenchPhoto>
> {
  declare id: CreationOptional<number>;
  declare workshopId: number;
  declare revisionId: number;
  declare itemKey: string;
  declare storageKey: string;
  declare fileName: string;
  declare contentType: 'image/png' | 'image/jpeg';
  declare sizeBytes: number;
  declare sha256: string;
  declare takenById: number | null;
  declare takenByName: string;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    BenchPhoto.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        workshopId: { type: DataTypes.INTEGER, allowNull: false },
        revisionId: { type: DataTypes.INTEGER, allowNull: false },
        itemKey: { type: DataTypes.TEXT, allowNull: false },
        storageKey: { type: DataTypes.TEXT, allowNull: false },
        fileName: { type: DataTypes.TEXT, allowNull: false },
        contentType: { type: DataTypes.TEXT, allowNull: false },
        sizeBytes: { type: DataTypes.INTEGER, allowNull: false },
        sha256: { type: DataTypes.TEXT, allowNull: false },
        takenById: { type: DataTypes.INTEGER, allowNull: true },
        takenByName: { type: DataTypes.TEXT, allowNull: false },
        createdAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'bench_photos', updatedAt: false },
    );
  }
}
