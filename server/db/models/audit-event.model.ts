import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';

/** One line of the append-only audit trail (the table refuses UPDATE and DELETE). */
export class AuditEvent extends Model<
  InferAttributes<AuditEvent>,
  InferCreationAttributes<AuditEvent>
> {
  declare id: CreationOptional<number>;
  declare workshopId: number;
  declare conversionId: number | null;
  declare actorId: number | null;
  declare actorName: string;
  declare action: string;
  declare entityType: string;
  declare entityId: number | null;
  declare summary: string;
  declare beforeJson: string | null;
  declare afterJson: string | null;
  declare requestId: string | null;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    AuditEvent.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        workshopId: { type: DataTypes.INTEGER, allowNull: false },
        conversionId: { type: DataTypes.INTEGER, allowNull: true },
        actorId: { type: DataTypes.INTEGER, allowNull: true },
        actorName: { type: DataTypes.TEXT, allowNull: false },
        action: { type: DataTypes.TEXT, allowNull: false },
        entityType: { type: DataTypes.TEXT, allowNull: false },
        entityId: { type: DataTypes.INTEGER, allowNull: true },
        summary: { type: DataTypes.TEXT, allowNull: false },
        beforeJson: { type: DataTypes.TEXT, allowNull: true },
        afterJson: { type: DataTypes.TEXT, allowNull: true },
        requestId: { type: DataTypes.TEXT, allowNull: true },
        createdAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'audit_events', updatedAt: false },
    );
  }
}
