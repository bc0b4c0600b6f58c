import { DataTypes, type ForeignKey, type NonAttribute, type Sequelize, type CreationOptional } from 'sequelize';
import { commonColumns, TrimsheetModel } from './columns';
import { craftRoles, type CraftRole } from '@/shared/schemas/roles';
import type { Craft } from './craft';
import type { User } from './user';

/**
 * A person's role on one craft; subsystem owners also list the subsystems whose rows they own, partners
 * the subsystems shared with them (by id, so renaming a subsystem keeps them).
 */
export class Membership extends TrimsheetModel<Membership> {
  declare craftId: ForeignKey<Craft['id']>;
  declare userId: ForeignKey<User['id']>;
  declare role: CraftRole;
  declare subsystemIds: CreationOptional<string[]>;
  declare user?: NonAttribute<User>;
  declare craft?: NonAttribute<Craft>;

  static initModel(sequelize: Sequelize) {
    Membership.init(
      {
        ...commonColumns,
        role: { type: DataTypes.TEXT, allowNull: false, validate: { isIn: [craftRoles as readonly string[] as string[]] } },
        subsystemIds: { type: DataTypes.ARRAY(DataTypes.UUID), allowNull: false, defaultValue: [] },
      },
      { sequelize, tableName: 'memberships' },
    );
  }
}
