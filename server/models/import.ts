import { DataTypes, type CreationOptional, type ForeignKey, type Sequelize } from 'sequelize';
import type { ImportPreviewContent, ImportStep } from '@/shared/schemas/exchange';
import { commonColumns, TrimsheetModel } from './columns';
import type { Craft } from './craft';
import type { Revision } from './revision';
import type { User } from './user';

/** A workbook read against a revision: its preview, the steps accepting it applies, and whether it was accepted. */
export class Import extends TrimsheetModel<Import> {
  declare craftId: ForeignKey<Craft['id']>;
  declare revisionId: ForeignKey<Revision['id']>;
  declare createdById: ForeignKey<User['id']>;
  declare fileName: string;
  declare preview: ImportPreviewContent;
  declare steps: ImportStep[];
  declare state: CreationOptional<'pending' | 'accepted'>;
  declare studyId: CreationOptional<string | null>;
  declare expiresAt: Date;
  declare acceptedAt: CreationOptional<Date | null>;

  static initModel(sequelize: Sequelize) {
    Import.init(
      {
        ...commonColumns,
        fileName: { type: DataTypes.TEXT, allowNull: false },
        preview: { type: DataTypes.JSONB, allowNull: false },
        steps: { type: DataTypes.JSONB, allowNull: false },
        state: { type: DataTypes.TEXT, allowNull: false, defaultValue: 'pending' },
        studyId: { type: DataTypes.UUID, allowNull: true },
        expiresAt: { type: DataTypes.DATE, allowNull: false },
        acceptedAt: { type: DataTypes.DATE, allowNull: true },
      },
      { sequelize, tableName: 'imports' },
    );
  }
}
