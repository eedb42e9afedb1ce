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
import type { PartModel } from './part';
import type { ProductModel } from './product';
import type { ToolModel } from './tool';

/** One line of a product's bill of parts: part P of tool T at revision R, so many per unit. */
export class BillOfPartsModel extends Model<InferAttributes<BillOfPartsModel>, InferCreationAttributes<BillOfPartsModel>> {
  declare id: CreationOptional<string>;
  declare productId: ForeignKey<ProductModel['id']>;
  declare partId: ForeignKey<PartModel['id']>;
  /** The part's tool, repeated so the database can check the part and the revision belong to it. */
  declare toolId: ForeignKey<ToolModel['id']>;
  declare revision: number;
  declare quantityPerUnit: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  declare product?: NonAttribute<ProductModel>;
  declare part?: NonAttribute<PartModel>;
  declare tool?: NonAttribute<ToolModel>;

  static initModel(sequelize: Sequelize) {
    BillOfPartsModel.init(
      {
        id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
        productId: { type: DataTypes.UUID, allowNull: false },
        partId: { type: DataTypes.UUID, allowNull: false },
        toolId: { type: DataTypes.UUID, allowNull: false },
        revision: { type: DataTypes.INTEGER, allowNull: false },
        quantityPerUnit: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'bill_of_parts' },
    );
  }
}
