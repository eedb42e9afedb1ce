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
import type { ToolModel } from './tool';

export class PartModel extends Model<InferAttributes<PartModel>, InferCreationAttributes<PartModel>> {
  declare id: CreationOptional<string>;
  declare toolId: ForeignKey<ToolModel['id']>;
  declare name: string;
  declare resin: string;
  declare cavitiesPerShot: number;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  declare tool?: NonAttribute<ToolModel>;

  static initModel(sequelize: Sequelize) {
    PartModel.init(
      {
        id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
        toolId: { type: DataTypes.UUID, allowNull: false },
        name: { type: DataTypes.STRING(120), allowNull: false },
        resin: { type: DataTypes.STRING(60), allowNull: false },
        cavitiesPerShot: { type: DataTypes.INTEGER, allowNull: false },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'parts' },
    );
  }
}
