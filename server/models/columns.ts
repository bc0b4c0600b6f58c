import { DataTypes } from 'sequelize';

/** Column definitions every table shares: a UUID key and the timestamps Sequelize maintains. */
export const commonColumns = {
  id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
  createdAt: DataTypes.DATE,
  updatedAt: DataTypes.DATE,
};
