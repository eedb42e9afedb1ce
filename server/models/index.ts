// Defines every model on one Sequelize instance, then their associations.
// A feature adds its models here: import, initModel, associations below.
import type { Sequelize } from 'sequelize';
import { AuditEventModel } from './audit-event';
import { BrandModel } from './brand';
import { CompanySettingModel } from './company-setting';
import { FactoryModel } from './factory';
import { initRegistryModels } from './registry';
import { initRequestModels } from './requests';
import { initToolLifeModels } from './tool-life';
import { UserModel } from './user';

export function initModels(sequelize: Sequelize) {
  for (const m of [BrandModel, FactoryModel, UserModel, AuditEventModel, CompanySettingModel]) m.initModel(sequelize);

  UserModel.belongsToMany(BrandModel, { through: 'user_brands', as: 'brands', foreignKey: 'userId', otherKey: 'brandId', timestamps: false });
  UserModel.belongsTo(FactoryModel, { as: 'factory', foreignKey: 'factoryId' });
  initRegistryModels(sequelize);
  initRequestModels(sequelize);
  initToolLifeModels(sequelize);
}

export { AuditEventModel, BrandModel, CompanySettingModel, FactoryModel, UserModel };
export { BillOfPartsModel, PartModel, ProductModel, ToolModel, ToolRevisionModel } from './registry';
export { AttachmentModel, ChangeItemModel, ChangeRequestModel, SignOffModel } from './requests';
export { ToolShotReadingModel } from './tool-life';
