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
import type { RequestState } from '../../shared/domain/lifecycle';
import type { AttachmentModel } from './attachment';
import type { ChangeItemModel } from './change-item';
import type { ProductModel } from './product';
import type { ToolModel } from './tool';
import type { UserModel } from './user';

/** A proposed change to one tool (DESIGN section 3). `version` guards concurrent edits. */
export class ChangeRequestModel extends Model<InferAttributes<ChangeRequestModel>, InferCreationAttributes<ChangeRequestModel>> {
  declare id: CreationOptional<string>;
  /** Human number (CR-0007), given by the database. */
  declare number: CreationOptional<number>;
  declare toolId: ForeignKey<ToolModel['id']>;
  declare title: string;
  declare reason: CreationOptional<string>;
  declare derivativeProductId: ForeignKey<ProductModel['id']> | null;
  /** Why the change is for no product (null or empty: not said). */
  declare noDerivativeReason: CreationOptional<string | null>;
  declare status: CreationOptional<RequestState>;
  declare targetDate: string | null;
  declare submitterId: ForeignKey<UserModel['id']>;
  declare movedProductIds: CreationOptional<string[]>;
  /** Computed on every save (shared/domain/impact.ts): kept for filters and the sign-offs. */
  declare irreversible: CreationOptional<boolean>;
  declare endedProductIds: CreationOptional<string[]>;
  declare retestRequired: CreationOptional<boolean>;
  declare retestNote: CreationOptional<string | null>;
  /** The engineer's estimate (lifecycle task): cost and lead days, costs of the ways to keep products. */
  declare estimate: CreationOptional<Record<string, unknown> | null>;
  declare numbersInputs: CreationOptional<Record<string, unknown> | null>;
  declare cutReport: CreationOptional<Record<string, unknown> | null>;
  /** When a toolmaker of the tool's factory confirmed receipt of the cut sheet (the sign-off has the signature). */
  declare cutSheetReceivedAt: CreationOptional<Date | null>;
  declare acceptedByRoles: CreationOptional<string[]>;
  declare stageEnteredAt: CreationOptional<Date>;
  declare stageDueAt: CreationOptional<Date | null>;
  /** The tool revision the change is made against, fixed at each sign-off before the cut (null: the tool's current one). */
  declare baseRevision: CreationOptional<number | null>;
  declare version: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  declare tool?: NonAttribute<ToolModel>;
  declare submitter?: NonAttribute<UserModel>;
  declare derivativeProduct?: NonAttribute<ProductModel | null>;
  declare items?: NonAttribute<ChangeItemModel[]>;
  declare attachments?: NonAttribute<AttachmentModel[]>;

  static initModel(sequelize: Sequelize) {
    ChangeRequestModel.init(
      {
        id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
        number: { type: DataTypes.INTEGER, autoIncrement: true, unique: true },
        toolId: { type: DataTypes.UUID, allowNull: false },
        title: { type: DataTypes.STRING(160), allowNull: false },
        reason: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
        derivativeProductId: { type: DataTypes.UUID, allowNull: true },
        noDerivativeReason: { type: DataTypes.TEXT, allowNull: true },
        status: { type: DataTypes.STRING(32), allowNull: false, defaultValue: 'draft' },
        targetDate: { type: DataTypes.DATEONLY, allowNull: true },
        submitterId: { type: DataTypes.UUID, allowNull: false },
        movedProductIds: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
        irreversible: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
        endedProductIds: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
        retestRequired: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
        retestNote: { type: DataTypes.TEXT, allowNull: true },
        estimate: { type: DataTypes.JSONB, allowNull: true },
        numbersInputs: { type: DataTypes.JSONB, allowNull: true },
        cutReport: { type: DataTypes.JSONB, allowNull: true },
        cutSheetReceivedAt: { type: DataTypes.DATE, allowNull: true },
        acceptedByRoles: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
        stageEnteredAt: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
        stageDueAt: { type: DataTypes.DATE, allowNull: true },
        baseRevision: { type: DataTypes.INTEGER, allowNull: true },
        version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      // version: Sequelize adds "AND version = n" to every UPDATE and raises OptimisticLockError on a miss.
      { sequelize, tableName: 'change_requests', version: true },
    );
  }
}
