import {
  DataTypes,
  Model,
  type CreationOptional,
  type ForeignKey,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';
import type { DriverType } from '#shared/domain/electrical/relays.ts';
import type { PulseSignal } from '#shared/domain/fields/text-parsers.ts';
import type { Disposition } from '#shared/domain/dispositions.ts';
import type { SignalClass } from '#shared/domain/signal-classes.ts';
import type { Connector } from './connector.model.ts';
import type { Conversion } from './conversion.model.ts';

/** One cavity of a connector and the wire in it. */
export class Pin extends Model<InferAttributes<Pin>, InferCreationAttributes<Pin>> {
  declare id: CreationOptional<number>;
  declare conversionId: ForeignKey<Conversion['id']>;
  declare connectorId: ForeignKey<Connector['id']>;
  declare cavity: string;
  declare position: number;
  declare function: CreationOptional<string>;
  declare signalClass: CreationOptional<SignalClass>;
  declare colour: CreationOptional<string>;
  declare sizeMm2: CreationOptional<number | null>;
  declare insulationRatingC: CreationOptional<number | null>;
  declare disposition: CreationOptional<Disposition>;
  declare destination: CreationOptional<string>;
  declare destinationPinId: CreationOptional<number | null>;
  declare destinationFeedId: CreationOptional<number | null>;
  declare runLengthM: CreationOptional<number | null>;
  declare loadCurrentA: CreationOptional<number | null>;
  declare driverType: CreationOptional<DriverType | null>;
  declare driverRatedA: CreationOptional<number | null>;
  declare pulseSignal: CreationOptional<PulseSignal | null>;
  declare pulsesPerRev: CreationOptional<number | null>;
  declare terminationOhm: CreationOptional<number | null>;
  declare notes: CreationOptional<string>;
  declare version: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    Pin.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        cavity: { type: DataTypes.TEXT, allowNull: false },
        position: { type: DataTypes.INTEGER, allowNull: false },
        function: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
        signalClass: { type: DataTypes.TEXT, allowNull: false, defaultValue: 'none' },
        colour: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
        sizeMm2: { type: DataTypes.REAL, allowNull: true },
        insulationRatingC: { type: DataTypes.INTEGER, allowNull: true },
        disposition: { type: DataTypes.TEXT, allowNull: false, defaultValue: 'undecided' },
        destination: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
        destinationPinId: { type: DataTypes.INTEGER, allowNull: true },
        destinationFeedId: { type: DataTypes.INTEGER, allowNull: true },
        runLengthM: { type: DataTypes.REAL, allowNull: true },
        loadCurrentA: { type: DataTypes.REAL, allowNull: true },
        driverType: { type: DataTypes.TEXT, allowNull: true },
        driverRatedA: { type: DataTypes.REAL, allowNull: true },
        pulseSignal: { type: DataTypes.TEXT, allowNull: true },
        pulsesPerRev: { type: DataTypes.REAL, allowNull: true },
        terminationOhm: { type: DataTypes.REAL, allowNull: true },
        notes: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
        version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'pins', version: true },
    );
  }
}
