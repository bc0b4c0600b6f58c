import { DataTypes, type ForeignKey, type Sequelize } from 'sequelize';
import type { AllowanceTable as AllowanceTableData } from '@/shared/schemas/allowance-tables';
import { commonColumns, TrimsheetModel } from './columns';
import type { Craft } from './craft';
import type { User } from './user';

/** A craft's own allowance table (one per craft), kept as the JSON the shared schema checked. */
export class AllowanceTable extends TrimsheetModel<AllowanceTable> {
  declare craftId: ForeignKey<Craft['id']>;
  declare preset: AllowanceTableData;
  declare updatedById: ForeignKey<User['id']> | null;

  static initModel(sequelize: Sequelize) {
    AllowanceTable.init(
      {
        ...commonColumns,
        preset: { type: DataTypes.JSONB, allowNull: false },
      },
      { sequelize, tableName: 'allowance_tables' },
    );
  }
}
