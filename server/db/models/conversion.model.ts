import {
  DataTypes,
  Model,
  type CreationOptional,
  type ForeignKey,
  type InferAttributes,
  type InferCreationAttributes,
  type NonAttribute,
  type Sequelize,
} from 'sequelize';
import type { User } from './user.model.ts';
import type { Workshop } from './workshop.model.ts';

export class Conversion extends Model<
  InferAttributes<Conversion>,
  InferCreationAttributes<Conversion>
> {
  declare id: CreationOptional<number>;
  declare workshopId: ForeignKey<Workshop['id']>;
  declare name: string;
  declare donorEngine: string;
  declare receivingVehicle: string;
  declare systemVoltage: number;
  declare notes: CreationOptional<string>;
  declare createdById: ForeignKey<User['id']> | null;
  declare version: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  declare createdBy?: NonAttribute<User | null>;

  static initModel(sequelize: Sequelize) {
    Conversion.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        name: { type: DataTypes.TEXT, allowNull: false },
        donorEngine: { type: DataTypes.TEXT, allowNull: false },
        receivingVehicle: { type: DataTypes.TEXT, allowNull: false },
        systemVoltage: { type: DataTypes.INTEGER, allowNull: false },
        notes: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
        version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'conversions', version: true },
    );
  }
}
