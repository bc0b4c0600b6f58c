import { Sequelize } from 'sequelize';
import type { Config } from './env';
import { initModels } from './models';

/** Opens a Sequelize connection pool for the configured database and registers the models on it. */
export function createDatabase(config: Pick<Config, 'databaseUrl' | 'databasePoolMax'>): Sequelize {
  const sequelize = new Sequelize(config.databaseUrl, {
    dialect: 'postgres',
    logging: false,
    pool: { max: config.databasePoolMax, idle: 10_000 },
    define: { underscored: true },
  });
  initModels(sequelize);
  return sequelize;
}
