import {
  DataTypes,
  Model,
  type CreationOptional,
  type ForeignKey,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';
import { commonColumns } from './columns';
import type { User } from './user';

/** One way a person signs in: a provider ('google' or 'sso') and that provider's subject identifier. */
export class Identity extends Model<InferAttributes<Identity>, InferCreationAttributes<Identity>> {
  declare id: CreationOptional<string>;
  declare userId: ForeignKey<User['id']>;
  declare provider: 'google' | 'sso';
  declare subject: string;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

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
