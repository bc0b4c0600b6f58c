import { DataTypes, type CreationOptional, type ForeignKey, type NonAttribute, type Sequelize } from 'sequelize';
import type { TokenScope } from '@/shared/schemas/tokens';
import { commonColumns, TrimsheetModel } from './columns';
import type { User } from './user';

/** A personal access token for scripts; only the SHA-256 hash of its secret is stored. */
export class AccessToken extends TrimsheetModel<AccessToken> {
  declare userId: ForeignKey<User['id']>;
  declare name: string;
  declare scope: TokenScope;
  declare tokenHash: string;
  declare prefix: string;
  declare lastUsedAt: CreationOptional<Date | null>;
  declare revokedAt: CreationOptional<Date | null>;
  declare user?: NonAttribute<User>;

  static initModel(sequelize: Sequelize) {
    AccessToken.init(
      {
        ...commonColumns,
        name: { type: DataTypes.TEXT, allowNull: false },
        scope: { type: DataTypes.TEXT, allowNull: false },
        tokenHash: { type: DataTypes.TEXT, allowNull: false, unique: true },
        prefix: { type: DataTypes.TEXT, allowNull: false },
        lastUsedAt: { type: DataTypes.DATE, allowNull: true },
        revokedAt: { type: DataTypes.DATE, allowNull: true },
      },
      { sequelize, tableName: 'access_tokens' },
    );
  }
}
