import { DataTypes, type ForeignKey, type Sequelize } from 'sequelize';
import { commonColumns, TrimsheetModel } from './columns';
import type { Craft } from './craft';

/** A subsystem of a craft: rows belong to one; owners and partners are named by its id. */
export class Subsystem extends TrimsheetModel<Subsystem> {
  declare craftId: ForeignKey<Craft['id']>;
  declare name: string;
  declare position: number;

  static initModel(sequelize: Sequelize) {
    Subsystem.init(
      {
        ...commonColumns,
        name: { type: DataTypes.TEXT, allowNull: false },
        position: { type: DataTypes.INTEGER, allowNull: false },
      },
      { sequelize, tableName: 'subsystems' },
    );
  }
}
