// The change-request models and their associations; called from initModels (index.ts) after the registry.
import type { Sequelize } from 'sequelize';
import { AttachmentModel } from './attachment';
import { ChangeItemModel } from './change-item';
import { ChangeRequestModel } from './change-request';
import { PartModel } from './part';
import { ProductModel } from './product';
import { SignOffModel } from './sign-off';
import { ToolModel } from './tool';
import { UserModel } from './user';

export function initRequestModels(sequelize: Sequelize) {
  for (const m of [ChangeRequestModel, ChangeItemModel, AttachmentModel, SignOffModel]) m.initModel(sequelize);

  ChangeRequestModel.belongsTo(ToolModel, { as: 'tool', foreignKey: 'toolId' });
  ChangeRequestModel.belongsTo(UserModel, { as: 'submitter', foreignKey: 'submitterId' });
  ChangeRequestModel.belongsTo(ProductModel, { as: 'derivativeProduct', foreignKey: 'derivativeProductId' });
  ChangeRequestModel.hasMany(ChangeItemModel, { as: 'items', foreignKey: 'requestId' });
  ChangeRequestModel.hasMany(AttachmentModel, { as: 'attachments', foreignKey: 'requestId' });
  ChangeRequestModel.hasMany(SignOffModel, { as: 'signOffs', foreignKey: 'requestId' });
  ChangeItemModel.belongsTo(ChangeRequestModel, { as: 'request', foreignKey: 'requestId' });
  ChangeItemModel.belongsTo(PartModel, { as: 'part', foreignKey: 'partId' });
  AttachmentModel.belongsTo(ChangeRequestModel, { as: 'request', foreignKey: 'requestId' });
  AttachmentModel.belongsTo(UserModel, { as: 'uploader', foreignKey: 'uploadedBy' });
  SignOffModel.belongsTo(ChangeRequestModel, { as: 'request', foreignKey: 'requestId' });
  SignOffModel.belongsTo(UserModel, { as: 'user', foreignKey: 'userId' });
}

export { AttachmentModel, ChangeItemModel, ChangeRequestModel, SignOffModel };
