import { DataTypes, type CreationOptional, type ForeignKey, type Sequelize } from 'sequelize';
import type { RevisionStanding } from '@/shared/access/permissions';
import { commonColumns, TrimsheetModel } from './columns';
import type { Craft } from './craft';
import type { User } from './user';

/**
 * One revision of a craft's sheet: the working draft, a locked baseline or a study. It holds the sheet's
 * header (name, budget settings); its rows are RevisionParameter records.
 */
export class Revision extends TrimsheetModel<Revision> {
  declare craftId: ForeignKey<Craft['id']>;
  declare kind: RevisionStanding['kind'];
  declare state: CreationOptional<RevisionStanding['state']>;
  declare parentId: string | null;
  declare label: string;
  declare note: CreationOptional<string>;
  declare sheetName: string;
  declare budgetPreset: string | null;
  declare requiredMarginPercent: number | null;
  declare createdById: ForeignKey<User['id']> | null;
  declare lockedById: CreationOptional<ForeignKey<User['id']> | null>;
  declare lockedAt: CreationOptional<Date | null>;

  static initModel(sequelize: Sequelize) {
    Revision.init(
      {
        ...commonColumns,
        kind: { type: DataTypes.TEXT, allowNull: false },
        state: { type: DataTypes.TEXT, allowNull: false, defaultValue: 'open' },
        parentId: { type: DataTypes.UUID, allowNull: true },
        label: { type: DataTypes.TEXT, allowNull: false },
        note: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
        sheetName: { type: DataTypes.TEXT, allowNull: false },
        budgetPreset: { type: DataTypes.TEXT, allowNull: true },
        requiredMarginPercent: { type: DataTypes.DOUBLE, allowNull: true },
        lockedAt: { type: DataTypes.DATE, allowNull: true },
      },
      { sequelize, tableName: 'revisions' },
    );
  }
}
