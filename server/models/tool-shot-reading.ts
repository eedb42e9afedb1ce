import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { ShotReadingSource } from '../../shared/schemas/tool-life-events';
import { asNumber } from './tool';

/** One shot-counter reading of a tool (append-only; a trigger refuses UPDATE and DELETE). */
export class ToolShotReadingModel extends Model<InferAttributes<ToolShotReadingModel>, InferCreationAttributes<ToolShotReadingModel>> {
  declare id: CreationOptional<string>;
  declare toolId: string;
  declare reading: number;
  /** The tool's counter just before this reading (so the record shows the step it made). */
  declare priorReading: number;
  declare readAt: Date;
  declare source: ShotReadingSource;
  declare recordedBy: string | null;
  /** The change request or move this reading was taken for, if any. */
  declare requestId: string | null;
  declare note: string | null;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    ToolShotReadingModel.init(
      {
        id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
        toolId: { type: DataTypes.UUID, allowNull: false },
        reading: { type: DataTypes.BIGINT, allowNull: false, get() { return asNumber(this.getDataValue('reading')) ?? 0; } },
        priorReading: { type: DataTypes.BIGINT, allowNull: false, get() { return asNumber(this.getDataValue('priorReading')) ?? 0; } },
        readAt: { type: DataTypes.DATE, allowNull: false },
        source: { type: DataTypes.STRING(16), allowNull: false },
        recordedBy: { type: DataTypes.UUID, allowNull: true },
        requestId: { type: DataTypes.UUID, allowNull: true },
        note: { type: DataTypes.TEXT, allowNull: true },
        createdAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'tool_shot_readings', updatedAt: false },
    );
  }
}
