import { DataTypes, type ForeignKey, type Sequelize } from 'sequelize';
import { commonColumns, TrimsheetModel } from './columns';
import type { SignInProvider } from '@/shared/schemas/session';
import type { User } from './user';

/**
 * One way a person signs in: a provider and that provider's subject identifier. An identity is linked to a
 * person deliberately (by the person, signed in, or through an invitation), never by e-mail alone.
 */
export class Identity extends TrimsheetModel<Identity> {
  declare userId: ForeignKey<User['id']>;
  declare provider: SignInProvider;
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
