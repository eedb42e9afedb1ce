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
import { constructions, retentionDecisions, toolStatuses, type Construction, type RetentionDecision, type ToolStatus } from '../../shared/schemas/registry';
import type { BrandModel } from './brand';
import type { FactoryModel } from './factory';
import type { PartModel } from './part';
import type { ToolRevisionModel } from './tool-revision';
import type { UserModel } from './user';

/** PostgreSQL returns bigint and numeric as text: read them back as numbers (all within safe range by CHECKs and inputs). */
export const asNumber = (v: unknown): number | null => (v === null || v === undefined ? null : Number(v));

export class ToolModel extends Model<InferAttributes<ToolModel>, InferCreationAttributes<ToolModel>> {
  declare id: CreationOptional<string>;
  declare code: string;
  declare name: string;
  declare brandId: ForeignKey<BrandModel['id']>;
  declare factoryId: ForeignKey<FactoryModel['id']>;
  declare construction: Construction;
  declare moldClass: number;
  declare ratedShots: number;
  declare ratedShotsSource: string;
  declare cavityCount: number;
  declare weightKg: number | null;
  declare buildCostCents: number | null;
  declare currency: CreationOptional<string>;
  declare buildDate: string | null;
  declare shotCount: CreationOptional<number>;
  declare lastRunDate: string | null;
  declare status: CreationOptional<ToolStatus>;
  declare storageLocation: string | null;
  declare currentRevision: CreationOptional<number>;
  declare version: CreationOptional<number>;
  declare retentionDecision: CreationOptional<RetentionDecision | null>;
  declare retentionKeepUntil: CreationOptional<string | null>;
  declare retentionDecidedBy: CreationOptional<string | null>;
  declare retentionDecidedAt: CreationOptional<Date | null>;
  declare retentionNote: CreationOptional<string | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  declare brand?: NonAttribute<BrandModel>;
  declare factory?: NonAttribute<FactoryModel>;
  declare decider?: NonAttribute<UserModel | null>;
  declare parts?: NonAttribute<PartModel[]>;
  declare revisions?: NonAttribute<ToolRevisionModel[]>;

  static initModel(sequelize: Sequelize) {
    ToolModel.init(
      {
        id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
        code: { type: DataTypes.STRING(32), allowNull: false, unique: true },
        name: { type: DataTypes.STRING(160), allowNull: false },
        brandId: { type: DataTypes.UUID, allowNull: false },
        factoryId: { type: DataTypes.UUID, allowNull: false },
        construction: { type: DataTypes.ENUM(...constructions), allowNull: false },
        moldClass: { type: DataTypes.SMALLINT, allowNull: false },
        ratedShots: { type: DataTypes.INTEGER, allowNull: false },
        ratedShotsSource: { type: DataTypes.TEXT, allowNull: false },
        cavityCount: { type: DataTypes.INTEGER, allowNull: false },
        weightKg: {
          type: DataTypes.DECIMAL(9, 2),
          allowNull: true,
          get() {
            return asNumber(this.getDataValue('weightKg'));
          },
        },
        buildCostCents: {
          type: DataTypes.BIGINT,
          allowNull: true,
          get() {
            return asNumber(this.getDataValue('buildCostCents'));
          },
        },
        currency: { type: DataTypes.CHAR(3), allowNull: false, defaultValue: 'USD' },
        buildDate: { type: DataTypes.DATEONLY, allowNull: true },
        shotCount: {
          type: DataTypes.BIGINT,
          allowNull: false,
          defaultValue: 0,
          get() {
            return asNumber(this.getDataValue('shotCount')) ?? 0;
          },
        },
        lastRunDate: { type: DataTypes.DATEONLY, allowNull: true },
        status: { type: DataTypes.ENUM(...toolStatuses), allowNull: false, defaultValue: 'active' },
        storageLocation: { type: DataTypes.STRING(160), allowNull: true },
        currentRevision: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
        version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        retentionDecision: { type: DataTypes.ENUM(...retentionDecisions), allowNull: true },
        retentionKeepUntil: { type: DataTypes.DATEONLY, allowNull: true },
        retentionDecidedBy: { type: DataTypes.UUID, allowNull: true },
        retentionDecidedAt: { type: DataTypes.DATE, allowNull: true },
        retentionNote: { type: DataTypes.TEXT, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      // version: Sequelize adds "AND version = n" to every UPDATE and raises OptimisticLockError on a miss.
      { sequelize, tableName: 'tools', version: true },
    );
  }
}
