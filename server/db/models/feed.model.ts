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
import type {
  DropClass,
  FeedSource,
  FuseType,
  LoadKind,
  ReturnPath,
  WireZone,
} from '#shared/schemas/feeds.schema.ts';
import type { Conversion } from './conversion.model.ts';

/** A new fused feed: fuse, optional relay, the wire from the fuse to its loads. */
export class Feed extends Model<InferAttributes<Feed>, InferCreationAttributes<Feed>> {
  declare id: CreationOptional<number>;
  declare conversionId: ForeignKey<Conversion['id']>;
  declare name: string;
  declare source: FeedSource;
  declare sourceFeedId: number | null;
  declare fuseA: number | null;
  declare fuseType: CreationOptional<FuseType>;
  declare unfusedLengthMm: CreationOptional<number | null>;
  declare fuseSheathed: CreationOptional<boolean>;
  declare hasRelay: boolean;
  declare relayContactRatingA: number | null;
  declare relayCoilCurrentA: number | null;
  declare relayCoilPinId: number | null;
  declare relayCoilResistanceOhm: CreationOptional<number | null>;
  declare wireSizeMm2: number;
  declare wireInsulationRatingC: number;
  declare wireLengthM: number;
  declare wireZone: WireZone;
  declare wireBundled: number;
  declare wireReturnPath: ReturnPath;
  declare wireColour: string;
  declare wireConnections: CreationOptional<number>;
  declare dropClass: DropClass;
  declare dropLimitPct: number | null;
  declare notes: CreationOptional<string>;
  declare version: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  declare loads?: NonAttribute<FeedLoad[]>;

  static initModel(sequelize: Sequelize) {
    Feed.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        name: { type: DataTypes.TEXT, allowNull: false },
        source: { type: DataTypes.TEXT, allowNull: false },
        sourceFeedId: { type: DataTypes.INTEGER, allowNull: true },
        fuseA: { type: DataTypes.REAL, allowNull: true },
        fuseType: { type: DataTypes.TEXT, allowNull: false, defaultValue: 'standard_blade' },
        unfusedLengthMm: { type: DataTypes.REAL, allowNull: true },
        fuseSheathed: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
        hasRelay: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
        relayContactRatingA: { type: DataTypes.REAL, allowNull: true },
        relayCoilCurrentA: { type: DataTypes.REAL, allowNull: true },
        relayCoilPinId: { type: DataTypes.INTEGER, allowNull: true },
        relayCoilResistanceOhm: { type: DataTypes.REAL, allowNull: true },
        wireSizeMm2: { type: DataTypes.REAL, allowNull: false },
        wireInsulationRatingC: { type: DataTypes.INTEGER, allowNull: false },
        wireLengthM: { type: DataTypes.REAL, allowNull: false },
        wireZone: { type: DataTypes.TEXT, allowNull: false },
        wireBundled: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
        wireReturnPath: { type: DataTypes.TEXT, allowNull: false },
        wireColour: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
        wireConnections: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 4 },
        dropClass: { type: DataTypes.TEXT, allowNull: false },
        dropLimitPct: { type: DataTypes.REAL, allowNull: true },
        notes: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
        version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'feeds', version: true },
    );
  }
}

/** Something the feed powers: a pin of the map, or a named device. */
export class FeedLoad extends Model<InferAttributes<FeedLoad>, InferCreationAttributes<FeedLoad>> {
  declare id: CreationOptional<number>;
  declare feedId: ForeignKey<Feed['id']>;
  declare pinId: number | null;
  declare name: string;
  declare currentA: number;
  declare continuous: boolean;
  declare kind: CreationOptional<LoadKind>;
  declare position: number;

  static initModel(sequelize: Sequelize) {
    FeedLoad.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        pinId: { type: DataTypes.INTEGER, allowNull: true },
        name: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
        currentA: { type: DataTypes.REAL, allowNull: false },
        continuous: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
        kind: { type: DataTypes.TEXT, allowNull: false, defaultValue: 'resistive' },
        position: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      },
      { sequelize, tableName: 'feed_loads', timestamps: false },
    );
  }
}
