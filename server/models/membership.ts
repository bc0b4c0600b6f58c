import { DataTypes, type ForeignKey, type NonAttribute, type Sequelize, type CreationOptional } from 'sequelize';
import { commonColumns, TrimsheetModel } from './columns';
import { craftRoles, type CraftRole } from '@/shared/schemas/roles';
import type { Craft } from './craft';
import type { User } from './user';

/** A person's role on one craft; subsystem owners also list the subsystems whose rows they own. */
export class Membership extends TrimsheetModel<Membership> {
  declare craftId: ForeignKey<Craft['id']>;
  declare userId: ForeignKey<User['id']>;
  declare role: CraftRole;
  declare subsystems: CreationOptional<string[]>;
  declare user?: NonAttribute<User>;
  declare craft?: NonAttribute<Craft>;

  static initModel(sequelize: Sequelize) {
    Membership.init(
      {
        ...commonColumns,
        role: { type: DataTypes.TEXT, allowNull: false, validate: { isIn: [craftRoles as readonly string[] as string[]] } },
        subsystems: { type: DataTypes.ARRAY(DataTypes.TEXT), allowNull: false, defaultValue: [] },
      },
      { sequelize, tableName: 'memberships' },
    );
  }
}
