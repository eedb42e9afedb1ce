import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

// Append-only (a database trigger refuses UPDATE and DELETE).
export class AuditEventModel extends Model<InferAttributes<AuditEventModel>, InferCreationAttributes<AuditEventModel>> {
  declare id: CreationOptional<string>;
  declare at: CreationOptional<Date>;
  declare actorId: string | null;
  declare actorName: string | null;
  declare action: string;
  declare entity: string;
  declare entityId: string | null;
  declare before: unknown;
  declare after: unknown;
  /** Position in the audit chain (null for events written before the chain began). */
  declare seq: CreationOptional<number | null>;
  declare prevHash: CreationOptional<string | null>;
  declare hash: CreationOptional<string | null>;

  static initModel(sequelize: Sequelize) {
    AuditEventModel.init(
      {
        id: { type: DataTypes.BIGINT, autoIncrement: true, primaryKey: true },
        at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
        actorId: { type: DataTypes.UUID, allowNull: true },
        actorName: { type: DataTypes.STRING(120), allowNull: true },
        action: { type: DataTypes.STRING(64), allowNull: false },
        entity: { type: DataTypes.STRING(64), allowNull: false },
        entityId: { type: DataTypes.STRING(64), allowNull: true },
        before: { type: DataTypes.JSONB, allowNull: true },
        after: { type: DataTypes.JSONB, allowNull: true },
        seq: { type: DataTypes.BIGINT, allowNull: true },
        prevHash: { type: DataTypes.STRING(64), allowNull: true },
        hash: { type: DataTypes.STRING(64), allowNull: true },
      },
      { sequelize, tableName: 'audit_events', timestamps: false },
    );
  }
}
