import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes } from 'sequelize';

/** What every Trimsheet table has: a UUID key and the timestamps Sequelize maintains. */
export abstract class TrimsheetModel<M extends Model> extends Model<InferAttributes<M>, InferCreationAttributes<M>> {
  declare id: CreationOptional<string>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

/** The column definitions of TrimsheetModel's attributes, spread into each model's init. */
export const commonColumns = {
  id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
  createdAt: DataTypes.DATE,
  updatedAt: DataTypes.DATE,
};
