import {
  DataTypes,
  Model,
  type CreationOptional,
  type ForeignKey,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';
import type { ToolModel } from './tool';

/** A tool's history: revision 1 is the tool as built; each executed change adds the next number. */
export class ToolRevisionModel extends Model<InferAttributes<ToolRevisionModel>, InferCreationAttributes<ToolRevisionModel>> {
  declare id: CreationOptional<string>;
  declare toolId: ForeignKey<ToolModel['id']>;
  declare number: number;
  declare madeOn: string;
  /** The change request that made it (no foreign key until change requests exist). */
  declare changeRequestId: string | null;
  declare note: string | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    ToolRevisionModel.init(
      {
        id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
        toolId: { type: DataTypes.UUID, allowNull: false },
        number: { type: DataTypes.INTEGER, allowNull: false },
        madeOn: { type: DataTypes.DATEONLY, allowNull: false },
        changeRequestId: { type: DataTypes.UUID, allowNull: true },
        note: { type: DataTypes.TEXT, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'tool_revisions' },
    );
  }
}
