import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type NonAttribute,
  type Sequelize,
} from 'sequelize';
import { roles, type Role } from '../../shared/schemas/users';
import type { BrandModel } from './brand';
import type { FactoryModel } from './factory';

export class UserModel extends Model<InferAttributes<UserModel>, InferCreationAttributes<UserModel>> {
  declare id: CreationOptional<string>;
  declare email: string;
  declare name: string;
  declare role: Role;
  declare passwordHash: string | null;
  declare active: CreationOptional<boolean>;
  declare timeZone: CreationOptional<string>;
  /** 'en' or 'zh-Hans' (shared/i18n): screens, mail and error messages. */
  declare language: CreationOptional<string>;
  declare factoryId: string | null;
  declare inviteTokenHash: CreationOptional<string | null>;
  declare inviteExpiresAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare brands?: NonAttribute<BrandModel[]>;
  declare factory?: NonAttribute<FactoryModel | null>;

  static initModel(sequelize: Sequelize) {
    UserModel.init(
      {
        id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
        email: {
          type: DataTypes.STRING(320),
          allowNull: false,
          unique: true,
          set(v: string) {
            this.setDataValue('email', v.trim().toLowerCase());
          },
        },
        name: { type: DataTypes.STRING(120), allowNull: false },
        role: { type: DataTypes.ENUM(...roles), allowNull: false },
        passwordHash: { type: DataTypes.STRING, allowNull: true },
        active: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
        timeZone: { type: DataTypes.STRING(64), allowNull: false, defaultValue: 'UTC' },
        language: { type: DataTypes.STRING(16), allowNull: false, defaultValue: 'en' },
        factoryId: { type: DataTypes.UUID, allowNull: true },
        inviteTokenHash: { type: DataTypes.STRING(64), allowNull: true },
        inviteExpiresAt: { type: DataTypes.DATE, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'users' },
    );
  }
}
