// The tool registry's models and their associations; called from initModels (index.ts).
import type { Sequelize } from 'sequelize';
import { BillOfPartsModel } from './bill-of-parts';
import { BrandModel } from './brand';
import { FactoryModel } from './factory';
import { PartModel } from './part';
import { ProductModel } from './product';
import { ToolModel } from './tool';
import { ToolRevisionModel } from './tool-revision';
import { UserModel } from './user';

export function initRegistryModels(sequelize: Sequelize) {
  for (const m of [ToolModel, PartModel, ToolRevisionModel, ProductModel, BillOfPartsModel]) m.initModel(sequelize);

  ToolModel.belongsTo(BrandModel, { as: 'brand', foreignKey: 'brandId' });
  ToolModel.belongsTo(FactoryModel, { as: 'factory', foreignKey: 'factoryId' });
  ToolModel.belongsTo(UserModel, { as: 'decider', foreignKey: 'retentionDecidedBy', constraints: false });
  ToolModel.hasMany(PartModel, { as: 'parts', foreignKey: 'toolId' });
  ToolModel.hasMany(ToolRevisionModel, { as: 'revisions', foreignKey: 'toolId' });
  PartModel.belongsTo(ToolModel, { as: 'tool', foreignKey: 'toolId' });
  ToolRevisionModel.belongsTo(ToolModel, { as: 'tool', foreignKey: 'toolId' });

  ProductModel.belongsTo(BrandModel, { as: 'brand', foreignKey: 'brandId' });
  ProductModel.hasMany(BillOfPartsModel, { as: 'bill', foreignKey: 'productId' });
  BillOfPartsModel.belongsTo(ProductModel, { as: 'product', foreignKey: 'productId' });
  BillOfPartsModel.belongsTo(PartModel, { as: 'part', foreignKey: 'partId' });
  BillOfPartsModel.belongsTo(ToolModel, { as: 'tool', foreignKey: 'toolId' });
  PartModel.hasMany(BillOfPartsModel, { as: 'billLines', foreignKey: 'partId' });
}

export { BillOfPartsModel, PartModel, ProductModel, ToolModel, ToolRevisionModel };
