import { DataTypes, type ForeignKey, type Sequelize } from 'sequelize';
import { commonColumns, TrimsheetModel } from './columns';
import type { User } from './user';

/** One way a person signs in: a provider ('google' or 'sso') and that provider's subject identifier. */
export class Identity extends TrimsheetModel<Identity> {
  declare userId: ForeignKey<User['id']>;
  declare provider: 'google' | 'sso';
  declare subject: string;

  static initModel(sequelize: Sequelize) {
    Identity.init(
      {
        ...commonColumns,
        provider: { type: DataTypes.TEXT, allowNull: false },
        subject: { type: DataTypes.TEXT, allowNull: false },
      },
      { sequelize, tableName: 'identities' },
    );
  }
}
