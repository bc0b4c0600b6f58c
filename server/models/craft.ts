import { DataTypes, type ForeignKey, type NonAttribute, type Sequelize, type CreationOptional } from 'sequelize';
import { commonColumns, TrimsheetModel } from './columns';
import type { Membership } from './membership';
import type { Organisation } from './organisation';
import type { User } from './user';

export class Craft extends TrimsheetModel<Craft> {
  declare organisationId: ForeignKey<Organisation['id']>;
  declare createdById: ForeignKey<User['id']> | null;
  declare name: string;
  declare description: CreationOptional<string>;
  declare templateId: CreationOptional<string>;
  declare memberships?: NonAttribute<Membership[]>;

  static initModel(sequelize: Sequelize) {
    Craft.init(
      {
        ...commonColumns,
        name: { type: DataTypes.TEXT, allowNull: false },
        description: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
        templateId: { type: DataTypes.TEXT, allowNull: false, defaultValue: 'square-sail' },
      },
      { sequelize, tableName: 'crafts' },
    );
  }
}
