import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

export class CompanySettingModel extends Model<InferAttributes<CompanySettingModel>, InferCreationAttributes<CompanySettingModel>> {
  declare key: string;
  declare value: unknown;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    CompanySettingModel.init(
      {
        key: { type: DataTypes.STRING(64), primaryKey: true },
        value: { type: DataTypes.JSONB, allowNull: false },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'company_settings' },
    );
  }
}
