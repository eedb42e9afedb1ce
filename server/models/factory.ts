import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

export class FactoryModel extends Model<InferAttributes<FactoryModel>, InferCreationAttributes<FactoryModel>> {
  declare id: CreationOptional<string>;
  declare name: string;
  declare city: string;
  declare country: string;
  declare timeZone: CreationOptional<string>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    FactoryModel.init(
      {
        id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
        name: { type: DataTypes.STRING(120), allowNull: false, unique: true },
        city: { type: DataTypes.STRING(120), allowNull: false },
        country: { type: DataTypes.STRING(80), allowNull: false },
        timeZone: { type: DataTypes.STRING(64), allowNull: false, defaultValue: 'UTC' },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'factories' },
    );
  }
}
