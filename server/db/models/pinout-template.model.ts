import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type NonAttribute,
  type Sequelize,
} from 'sequelize';
import type { DriverType } from '#shared/domain/electrical/relays.ts';
import type { PulseSignal } from '#shared/domain/fields/text-parsers.ts';
import type { Disposition } from '#shared/domain/dispositions.ts';
import type { SignalClass } from '#shared/domain/signal-classes.ts';
import type { ConnectorSide } from '#shared/schemas/pin-map.schema.ts';
import type { User } from './user.model.ts';

/** A saved connector pinout. Built-in ones have no workshop and are read-only (DB triggers). */
export class PinoutTemplate extends Model<
  InferAttributes<PinoutTemplate>,
  InferCreationAttributes<PinoutTemplate>
> {
  declare id: CreationOptional<number>;
  declare workshopId: number | null;
  declare builtIn: CreationOptional<boolean>;
  declare name: string;
  declare side: ConnectorSide;
  declare description: CreationOptional<string>;
  declare cavityCount: number;
  declare rows: number;
  declare columns: number;
  declare createdById: number | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare createdBy?: NonAttribute<User | null>;
  declare pins?: NonAttribute<PinoutTemplatePin[]>;

  static initModel(sequelize: Sequelize) {
    PinoutTemplate.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        workshopId: { type: DataTypes.INTEGER, allowNull: true },
        builtIn: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
        name: { type: DataTypes.TEXT, allowNull: false },
        side: { type: DataTypes.TEXT, allowNull: false },
        description: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
        cavityCount: { type: DataTypes.INTEGER, allowNull: false },
        rows: { type: DataTypes.INTEGER, allowNull: false },
        columns: { type: DataTypes.INTEGER, allowNull: false },
        createdById: { type: DataTypes.INTEGER, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'pinout_templates' },
    );
  }
}

export class PinoutTemplatePin extends Model<
  InferAttributes<PinoutTemplatePin>,
  InferCreationAttributes<PinoutTemplatePin>
> {
  declare id: CreationOptional<number>;
  declare templateId: number;
  declare cavity: string;
  declare position: number;
  declare function: CreationOptional<string>;
  declare signalClass: CreationOptional<SignalClass>;
  declare colour: CreationOptional<string>;
  declare sizeMm2: CreationOptional<number | null>;
  declare insulationRatingC: CreationOptional<number | null>;
  declare disposition: CreationOptional<Disposition>;
  declare driverType: CreationOptional<DriverType | null>;
  declare driverRatedA: CreationOptional<number | null>;
  declare pulseSignal: CreationOptional<PulseSignal | null>;
  declare pulsesPerRev: CreationOptional<number | null>;
  declare terminationOhm: CreationOptional<number | null>;
  declare notes: CreationOptional<string>;

  static initModel(sequelize: Sequelize) {
    PinoutTemplatePin.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        templateId: { type: DataTypes.INTEGER, allowNull: false },
        cavity: { type: DataTypes.TEXT, allowNull: false },
        position: { type: DataTypes.INTEGER, allowNull: false },
        function: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
        signalClass: { type: DataTypes.TEXT, allowNull: false, defaultValue: 'none' },
        colour: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
        sizeMm2: { type: DataTypes.REAL, allowNull: true },
        insulationRatingC: { type: DataTypes.INTEGER, allowNull: true },
        disposition: { type: DataTypes.TEXT, allowNull: false, defaultValue: 'undecided' },
        driverType: { type: DataTypes.TEXT, allowNull: true },
        driverRatedA: { type: DataTypes.REAL, allowNull: true },
        pulseSignal: { type: DataTypes.TEXT, allowNull: true },
        pulsesPerRev: { type: DataTypes.REAL, allowNull: true },
        terminationOhm: { type: DataTypes.REAL, allowNull: true },
        notes: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
      },
      { sequelize, tableName: 'pinout_template_pins', timestamps: false },
    );
  }
}
