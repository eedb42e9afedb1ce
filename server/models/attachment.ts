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
import type { AttachmentKind } from '../../shared/schemas/change-requests';
import type { ChangeItemModel } from './change-item';
import type { ChangeRequestModel } from './change-request';
import type { UserModel } from './user';

/**
 * An uploaded image of a change request, checked by content (server/lib/images.ts), with its
 * SHA-256 and a WebP thumbnail. The bytes live in the database (BYTEA): load them only to serve them.
 */
export class AttachmentModel extends Model<InferAttributes<AttachmentModel>, InferCreationAttributes<AttachmentModel>> {
  declare id: CreationOptional<string>;
  declare requestId: ForeignKey<ChangeRequestModel['id']>;
  declare itemId: ForeignKey<ChangeItemModel['id']> | null;
  declare kind: AttachmentKind;
  declare filename: string;
  declare contentType: string;
  declare size: number;
  declare sha256: string;
  declare width: number | null;
  declare height: number | null;
  declare data: Buffer;
  declare thumbnail: Buffer | null;
  declare uploadedBy: ForeignKey<UserModel['id']>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  declare uploader?: NonAttribute<UserModel>;
  declare request?: NonAttribute<ChangeRequestModel>;

  static initModel(sequelize: Sequelize) {
    AttachmentModel.init(
      {
        id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
        requestId: { type: DataTypes.UUID, allowNull: false },
        itemId: { type: DataTypes.UUID, allowNull: true },
        kind: { type: DataTypes.STRING(16), allowNull: false },
        filename: { type: DataTypes.STRING(200), allowNull: false },
        contentType: { type: DataTypes.STRING(100), allowNull: false },
        size: { type: DataTypes.INTEGER, allowNull: false },
        sha256: { type: DataTypes.CHAR(64), allowNull: false },
        width: { type: DataTypes.INTEGER, allowNull: true },
        height: { type: DataTypes.INTEGER, allowNull: true },
        data: { type: DataTypes.BLOB, allowNull: false },
        thumbnail: { type: DataTypes.BLOB, allowNull: true },
        uploadedBy: { type: DataTypes.UUID, allowNull: false },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'attachments' },
    );
  }
}
