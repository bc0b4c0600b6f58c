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
import type { Membership } from './membership';
import type { Organisation } from './organisation';
import type { User } from './user';

export class Craft extends Model<InferAttributes<Craft>, InferCreationAttributes<Craft>> {
  declare id: CreationOptional<string>;
  declare organisationId: ForeignKey<Organisation['id']>;
  declare createdById: ForeignKey<User['id']> | null;
  declare name: string;
  declare description: CreationOptional<string>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare memberships?: NonAttribute<Membership[]>;

  static initModel(sequelize: Sequelize) {
    Craft.init(
      {
        ...commonColumns,
        name: { type: DataTypes.TEXT, allowNull: false },
        description: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
      },
      { sequelize, tableName: 'crafts' },
    );
  }
}
