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
import { commonColumns } from './columns';
import type { Organisation } from './organisation';

export class User extends Model<InferAttributes<User>, InferCreationAttributes<User>> {
  declare id: CreationOptional<string>;
  declare organisationId: ForeignKey<Organisation['id']>;
  declare email: string;
  declare name: string;
  declare isOrgAdmin: CreationOptional<boolean>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
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
