import { DataTypes, type ForeignKey, type NonAttribute, type Sequelize, type CreationOptional } from 'sequelize';
import { commonColumns, TrimsheetModel } from './columns';
import type { Organisation } from './organisation';

export class User extends TrimsheetModel<User> {
  declare organisationId: ForeignKey<Organisation['id']>;
  declare email: string;
  declare name: string;
  declare isOrgAdmin: CreationOptional<boolean>;
  declare organisation?: NonAttribute<Organisation>;

  static initModel(sequelize: Sequelize) {
    User.init(
      {
        ...commonColumns,
        email: { type: DataTypes.TEXT, allowNull: false, unique: true },
        name: { type: DataTypes.TEXT, allowNull: false },
        isOrgAdmin: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
      },
      { sequelize, tableName: 'users' },
    );
  }
}
