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
import type { ItemMethod, PartEffect, RegionMark, SafetyFlag, SizeUnit } from '../../shared/schemas/change-items';
import type { ChangeRequestModel } from './change-request';
import type { PartModel } from './part';

/** One cut item of a change request: one change to one part of the request's tool. */
export class ChangeItemModel extends Model<InferAttributes<ChangeItemModel>, InferCreationAttributes<ChangeItemModel>> {
  declare id: CreationOptional<string>;
  declare requestId: ForeignKey<ChangeRequestModel['id']>;
  declare position: number;
  declare partId: ForeignKey<PartModel['id']>;
  declare effect: PartEffect;
  declare method: ItemMethod;
  /** The decimal as typed ("0.8"), in `unit`. */
  declare size: string;
  declare unit: SizeUnit;
  declare note: CreationOptional<string>;
  declare safetyFlags: CreationOptional<SafetyFlag[]>;
  declare region: RegionMark | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  declare part?: NonAttribute<PartModel>;

  static initModel(sequelize: Sequelize) {
    ChangeItemModel.init(
      {
        id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
        requestId: { type: DataTypes.UUID, allowNull: false },
        position: { type: DataTypes.INTEGER, allowNull: false },
        partId: { type: DataTypes.UUID, allowNull: false },
        effect: { type: DataTypes.STRING(32), allowNull: false },
        method: { type: DataTypes.STRING(32), allowNull: false },
        size: { type: DataTypes.STRING(12), allowNull: false },
        unit: { type: DataTypes.STRING(4), allowNull: false, defaultValue: 'mm' },
        note: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
        safetyFlags: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
        region: { type: DataTypes.JSONB, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'change_items' },
    );
  }
}
