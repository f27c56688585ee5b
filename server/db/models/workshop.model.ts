import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';
import type { PaperSize, SizeUnit } from '#shared/schemas/workshop.schema.ts';

export class Workshop extends Model<InferAttributes<Workshop>, InferCreationAttributes<Workshop>> {
  declare id: CreationOptional<number>;
  declare name: string;
  declare paperSize: CreationOptional<PaperSize>;
  declare sizeUnit: CreationOptional<SizeUnit>;
  declare systemVoltage: CreationOptional<number>;
  declare defaultInsulationC: CreationOptional<number>;
  declare serviceAllowancePct: CreationOptional<number>;
  declare dropFuseV: CreationOptional<number>;
  declare dropRelayContactsV: CreationOptional<number>;
  declare dropPerConnectionV: CreationOptional<number>;
  declare dropChassisReturnV: CreationOptional<number>;
  declare version: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    Workshop.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        name: { type: DataTypes.TEXT, allowNull: false },
        paperSize: { type: DataTypes.TEXT, allowNull: false, defaultValue: 'A4' },
        sizeUnit: { type: DataTypes.TEXT, allowNull: false, defaultValue: 'mm2' },
        systemVoltage: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 12 },
        defaultInsulationC: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 105 },
        serviceAllowancePct: { type: DataTypes.REAL, allowNull: false, defaultValue: 15 },
        dropFuseV: { type: DataTypes.REAL, allowNull: false, defaultValue: 0.1 },
        dropRelayContactsV: { type: DataTypes.REAL, allowNull: false, defaultValue: 0.1 },
        dropPerConnectionV: { type: DataTypes.REAL, allowNull: false, defaultValue: 0.005 },
        dropChassisReturnV: { type: DataTypes.REAL, allowNull: false, defaultValue: 0.05 },
        version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'workshops', version: true },
    );
  }
}
