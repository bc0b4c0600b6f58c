import { DataTypes, type ForeignKey, type NonAttribute, type Sequelize, type CreationOptional } from 'sequelize';
import { commonColumns, TrimsheetModel } from './columns';
import type { Organisation } from './organisation';
import type { SignInProvider } from '@/shared/schemas/session';
import type { User } from './user';

/**
 * An organisation admin's invitation. A first sign-in with a verified address accepts it; one naming a
 * provider can also link that provider's sign-in to a person of the organisation who already has the address.
 */
export class Invitation extends TrimsheetModel<Invitation> {
  declare organisationId: ForeignKey<Organisation['id']>;
  declare invitedById: ForeignKey<User['id']>;
  declare email: string;
  declare name: string;
  /** The provider the invitation is for; null: either (a new person only). */
  declare provider: CreationOptional<SignInProvider | null>;
  declare acceptedAt: CreationOptional<Date | null>;
  declare withdrawnAt: CreationOptional<Date | null>;
  declare withdrawnById: CreationOptional<ForeignKey<User['id']> | null>;
  declare invitedBy?: NonAttribute<User>;

  static initModel(sequelize: Sequelize) {
    Invitation.init(
      {
        ...commonColumns,
        email: { type: DataTypes.TEXT, allowNull: false },
        name: { type: DataTypes.TEXT, allowNull: false },
        provider: { type: DataTypes.TEXT, allowNull: true },
        acceptedAt: { type: DataTypes.DATE, allowNull: true },
        withdrawnAt: { type: DataTypes.DATE, allowNull: true },
        withdrawnById: { type: DataTypes.UUID, allowNull: true },
      },
      { sequelize, tableName: 'invitations' },
    );
  }
}
