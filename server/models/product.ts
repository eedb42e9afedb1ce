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
import { productStatuses, type ProductStatus } from '../../shared/schemas/registry';
import type { BillOfPartsModel } from './bill-of-parts';
import type { BrandModel } from './brand';
import { asNumber } from './tool';

const cents = (field: 'fobCents' | 'wholesaleCents' | 'retailCents') => ({
  type: DataTypes.BIGINT,
  allowNull: true,
  get(this: ProductModel) {
    return asNumber(this.getDataValue(field));
  },
});

export class ProductModel extends Model<InferAttributes<ProductModel>, InferCreationAttributes<ProductModel>> {
  declare id: CreationOptional<string>;
  declare sku: string;
  declare name: string;
  declare brandId: ForeignKey<BrandModel['id']>;
  declare status: CreationOptional<ProductStatus>;
  declare fobCents: number | null;
  declare wholesaleCents: number | null;
  declare retailCents: number | null;
  declare currency: CreationOptional<string>;
  declare plannedUnits: CreationOptional<number>;
  declare version: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  declare brand?: NonAttribute<BrandModel>;
  declare bill?: NonAttribute<BillOfPartsModel[]>;

  static initModel(sequelize: Sequelize) {
    ProductModel.init(
      {
        id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
        sku: { type: DataTypes.STRING(40), allowNull: false, unique: true },
        name: { type: DataTypes.STRING(160), allowNull: false },
        brandId: { type: DataTypes.UUID, allowNull: false },
        status: { type: DataTypes.ENUM(...productStatuses), allowNull: false, defaultValue: 'in_line' },
        fobCents: cents('fobCents'),
        wholesaleCents: cents('wholesaleCents'),
        retailCents: cents('retailCents'),
        currency: { type: DataTypes.CHAR(3), allowNull: false, defaultValue: 'USD' },
        plannedUnits: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'products', version: true },
    );
  }
}
