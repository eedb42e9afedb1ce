import {
  DataTypes,
  Model,
  type CreationOptional,
  type ForeignKey,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';
import type { RequestAction, RequestState, SignOffDecision } from '../../shared/domain/lifecycle';
import type { Role } from '../../shared/schemas/users';
import type { ChangeRequestModel } from './change-request';
import type { UserModel } from './user';

/**
 * One signature (or withdrawal) on a change request, in order (`seq`), each chained to the one
 * before by hash (tamper-evident record). Written by the lifecycle; never updated.
 */
export class SignOffModel extends Model<InferAttributes<SignOffModel>, InferCreationAttributes<SignOffModel>> {
  declare id: CreationOptional<string>;
  declare requestId: ForeignKey<ChangeRequestModel['id']>;
  declare seq: number;
  declare action: RequestAction;
  declare fromStatus: RequestState;
  declare toStatus: RequestState;
  declare role: Role;
  declare userId: ForeignKey<UserModel['id']>;
  declare printedName: string;
  declare decision: SignOffDecision;
  declare meaning: string;
  declare comment: CreationOptional<string>;
  declare signedAt: Date;
  declare contentHash: string;
  declare prevHash: string;
  declare hash: string;
  declare idempotencyKey: string | null;
  /** SHA-256 of the body the Idempotency-Key answered (password left out); null without a key. */
  declare idempotencyFingerprint: CreationOptional<string | null>;
  /** The request's signed content, as hashed into contentHash (canonical JSON of this value). */
  declare content: Record<string, unknown>;
  /** What the signer declared with the action (target, cut report, ticked products, re-test note). */
  declare details: CreationOptional<Record<string, unknown>>;

  static initModel(sequelize: Sequelize) {
    SignOffModel.init(
      {
        id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
        requestId: { type: DataTypes.UUID, allowNull: false },
        seq: { type: DataTypes.INTEGER, allowNull: false },
        action: { type: DataTypes.STRING(32), allowNull: false },
        fromStatus: { type: DataTypes.STRING(32), allowNull: false },
        toStatus: { type: DataTypes.STRING(32), allowNull: false },
        role: { type: DataTypes.STRING(16), allowNull: false },
        userId: { type: DataTypes.UUID, allowNull: false },
        printedName: { type: DataTypes.STRING(120), allowNull: false },
        decision: { type: DataTypes.STRING(32), allowNull: false },
        meaning: { type: DataTypes.TEXT, allowNull: false },
        comment: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
        signedAt: { type: DataTypes.DATE, allowNull: false },
        contentHash: { type: DataTypes.STRING(64), allowNull: false },
        prevHash: { type: DataTypes.STRING(64), allowNull: false },
        hash: { type: DataTypes.STRING(64), allowNull: false },
        idempotencyKey: { type: DataTypes.STRING(80), allowNull: true, unique: true },
        idempotencyFingerprint: { type: DataTypes.STRING(64), allowNull: true },
        content: { type: DataTypes.JSONB, allowNull: false },
        details: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
      },
      { sequelize, tableName: 'sign_offs', timestamps: false },
    );
  }
}
