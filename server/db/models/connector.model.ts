import {
  DataTypes,
  Model,
  type CreationOptional,
  type ForeignKey,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';
import type { ConnectorSide } from '#shared/schemas/pin-map.schema.ts';
import type { Conversion } from './conversion.model.ts';

export class Connector extends Model<
  InferAttributes<Connector>,
  InferCreationAttributes<Connector>
> {
  declare id: CreationOptional<number>;
  declare conversionId: ForeignKey<Conversion['id']>;
  declare label: string;
  declare side: ConnectorSide;
  declare cavityCount: number;
  declare rows: number;
  declare columns: number;
  declare notes: CreationOptional<string>;
  declare version: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    Connector.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        label: { type: DataTypes.TEXT, allowNull: false },
        side: { type: DataTypes.TEXT, allowNull: false },
        cavityCount: { type: DataTypes.INTEGER, allowNull: false },
        rows: { type: DataTypes.INTEGER, allowNull: false },
        columns: { type: DataTypes.INTEGER, allowNull: false },
        notes: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
        version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'connectors', version: true },
    );
  }
}
