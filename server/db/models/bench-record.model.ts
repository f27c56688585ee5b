import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';

/** One pin's bench work on a signed-off revision: done, tested, the continuity reading. */
export class BenchRecord extends Model<
  InferAttributes<BenchRecord>,
  InferCreationAttributes<BenchRecord>
> {
  declare id: CreationOptional<number>;
  declare revisionId: number;
  declare pinId: number;
  declare done: boolean;
  declare tested: boolean;
  declare resistanceOhm: number | null;
  declare note: string;
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
        pinId: { type: DataTypes.INTEGER, allowNull: false },
        done: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
        tested: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
        resistanceOhm: { type: DataTypes.REAL, allowNull: true },
        note: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
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
