import { DataTypes, type Sequelize } from 'sequelize';
import { commonColumns, TrimsheetModel } from './columns';

export class Organisation extends TrimsheetModel<Organisation> {
  declare name: string;
  declare slug: string;

  static initModel(sequelize: Sequelize) {
    Organisation.init(
      {
        ...commonColumns,
        name: { type: DataTypes.TEXT, allowNull: false },
        slug: { type: DataTypes.TEXT, allowNull: false, unique: true },
      },
      { sequelize, tableName: 'organisations' },
    );
  }
}
