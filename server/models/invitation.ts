import { DataTypes, type ForeignKey, type NonAttribute, type Sequelize, type CreationOptional } from 'sequelize';
import { commonColumns, TrimsheetModel } from './columns';
import type { Organisation } from './organisation';
import type { User } from './user';

/** An organisation admin's invitation; it is accepted when a person with that e-mail first signs in. */
export class Invitation extends TrimsheetModel<Invitation> {
  declare organisationId: ForeignKey<Organisation['id']>;
  declare invitedById: ForeignKey<User['id']>;
  declare email: string;
  declare name: string;
  declare acceptedAt: CreationOptional<Date | null>;
  declare invitedBy?: NonAttribute<User>;

  static initModel(sequelize: Sequelize) {
    Invitation.init(
      {
        ...commonColumns,
        email: { type: DataTypes.TEXT, allowNull: false },
        name: { type: DataTypes.TEXT, allowNull: false },
        acceptedAt: { type: DataTypes.DATE, allowNull: true },
      },
      { sequelize, tableName: 'invitations' },
    );
  }
}
